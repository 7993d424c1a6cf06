import { z } from "zod";

export const signOffSchema = z.object({
  baseVersion: z.number({ error: "Send the version you reviewed (baseVersion)" }).int().min(1),
  password: z.string({ error: "Enter your password to sign." }).min(1, "Enter your password to sign."),
  typedName: z
    .string({ error: "Type your name as you sign it." })
    .trim()
    .min(2, "Type your full name as you sign it.")
    .max(120, "The name can be at most 120 characters."),
  signatureImage: z
    .string({ error: "Draw your signature." })
    .regex(/^data:image\/png;base64,[A-Za-z0-9+/=]+$/, "Draw your signature in the box.")
    .max(300_000, "The signature image is too large; clear it and sign again."),
  /** The findings the signer acknowledged (lib/checks findingKey); the server refuses if one is missing. */
  acknowledged: z
    .array(z.string().max(200, "A finding reference is at most 200 characters."), { error: "Send the acknowledged findings as a list." })
    .max(500, "At most 500 acknowledged findings.")
    .default([]),
});
export type SignOffInput = z.infer<typeof signOffSchema>;

export const amendmentSchema = z.object({
  id: z.uuid("The amendment needs an id made by the device (UUID)."),
  what: z.string({ error: "Say what changes." }).trim().min(3, "Say what changes.").max(4_000, "Keep it under 4000 characters."),
  why: z.string({ error: "Say why it changes." }).trim().min(3, "Say why it changes.").max(4_000, "Keep it under 4000 characters."),
});
export type AmendmentInput = z.infer<typeof amendmentSchema>;
