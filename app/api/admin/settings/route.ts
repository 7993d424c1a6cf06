import { apiRoute } from "@/lib/api/handler";
import { authorizeAdmin } from "@/lib/auth/authorize";
import { readAccountSettings, updateAccountSettings } from "@/lib/users/admin-accounts";
import { accountSettingsSchema, type AccountSettingsInput } from "@/lib/users/schemas";

export const dynamic = "force-dynamic";

export const GET = apiRoute({}, async ({ user }) => {
  authorizeAdmin(user, "admin.users");
  return readAccountSettings();
});

export const PUT = apiRoute<Record<string, string>, AccountSettingsInput>({ body: accountSettingsSchema }, ({ user, body }) =>
  updateAccountSettings(user, body),
);
