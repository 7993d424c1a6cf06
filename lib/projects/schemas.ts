import { z } from "zod";
import { emailField, roleField } from "@/lib/users/schemas";

const timeZones = new Set(Intl.supportedValuesOf("timeZone").concat("UTC"));

export const projectSchema = z.object({
  name: z.string({ error: "Enter the project name." }).trim().min(2, "Enter the project name.").max(160, "The name can be at most 160 characters."),
  code: z
    .string({ error: "Enter a short project code." })
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9-]{2,32}$/, "The project code uses 2–32 letters, digits or dashes, like LC-01."),
  siteAddress: z.string().trim().max(300, "The site address can be at most 300 characters.").default(""),
  timeZone: z
    .string({ error: "Choose the site's time zone." })
    .refine((tz) => timeZones.has(tz), "Choose a time zone from the list, like America/Chicago."),
  unitSystem: z.enum(["SI", "IP"], { error: "Choose SI (metric) or inch-pound units." }),
});
export type ProjectInput = z.infer<typeof projectSchema>;

export const addMemberSchema = z.object({ email: emailField, role: roleField });
export const changeRoleSchema = z.object({ role: roleField });
