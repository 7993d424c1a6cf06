import { z } from "zod";
import { PROJECT_ROLES } from "@/lib/auth/roles";

export const MIN_PASSWORD_LENGTH = 10;

/** A new password: the one rule for invitations, the account page and the first administrator. */
export const passwordField = z
  .string({ error: "Choose a password." })
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters for your password.`)
  .max(200, "The password can be at most 200 characters.");

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
  password: passwordField,
});

export const signInLinkSchema = z.object({
  email: emailField,
  callbackUrl: z.string().max(500).optional(),
});

export const firstAdminSchema = z.object({ email: emailField, name: nameField, password: passwordField });
export type FirstAdminInput = z.infer<typeof firstAdminSchema>;

/** Set or change one's own password: the current one is needed once there is one. */
export const changePasswordSchema = z.object({
  currentPassword: z.string().max(200).optional(),
  newPassword: passwordField,
});
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

export const userStatusSchema = z.object({
  disabled: z.boolean({ error: "Say whether the account is disabled (true) or enabled (false)." }),
});

export const accountSettingsSchema = z.object({
  idleTimeoutMinutes: z.coerce
    .number({ error: "Enter the idle limit in minutes." })
    .int("Enter whole minutes.")
    .min(15, "The idle limit must be at least 15 minutes.")
    .max(43_200, "The idle limit can be at most 43,200 minutes (30 days, the longest a session lasts)."),
  offlineWindowHours: z.coerce
    .number({ error: "Enter the offline window in hours." })
    .int("Enter whole hours.")
    .min(1, "The offline window must be at least 1 hour.")
    .max(720, "The offline window can be at most 720 hours (30 days)."),
});
export type AccountSettingsInput = z.infer<typeof accountSettingsSchema>;
