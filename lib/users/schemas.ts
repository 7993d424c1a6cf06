import { z } from "zod";
import { PROJECT_ROLES } from "@/lib/auth/roles";

export const MIN_PASSWORD_LENGTH = 10;

export const emailField = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .email("Enter a valid e-mail address, like name@company.com.");

export const nameField = z
  .string({ error: "Enter the person's name." })
  .trim()
  .min(1, "Enter the person's name.")
  .max(120, "The name can be at most 120 characters.");

export const roleField = z.enum(PROJECT_ROLES, {
  error: "Choose a role: superintendent, inspector, office or owner.",
});

export const inviteSchema = z.object({
  email: emailField,
  name: nameField,
  projectId: z.uuid("Choose a project.").optional(),
  role: roleField.optional(),
}).refine((v) => (v.projectId === undefined) === (v.role === undefined), {
  message: "Choose both a project and a role, or neither.",
  path: ["role"],
});
export type InviteInput = z.infer<typeof inviteSchema>;

export const acceptInvitationSchema = z.object({
  token: z.string().min(10, "This invitation link is incomplete. Open the link from the e-mail again."),
  password: z
    .string({ error: "Choose a password." })
    .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters for your password.`)
    .max(200, "The password can be at most 200 characters."),
});

export const signInLinkSchema = z.object({
  email: emailField,
  callbackUrl: z.string().max(500).optional(),
});
