// Administrator actions on people and on the organisation's account settings.
import { eq, sql } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { transaction } from "@/db/transaction";
import { accountSettings, DEFAULT_IDLE_TIMEOUT_MINUTES, DEFAULT_OFFLINE_WINDOW_HOURS, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { authorizeAdmin } from "@/lib/auth/authorize";
import { bumpSessionVersion } from "@/lib/auth/user-sessions";
import { writeAudit } from "@/lib/audit";
import { AppError, notFound } from "@/lib/errors";
import type { AccountSettingsInput } from "./schemas";

/**
 * Disables a person (every session ends; sign-in, the API and sync refuse them) or enables them
 * again. Nothing of theirs is deleted: records, signatures, audit entries and memberships stay.
 */
export async function setUserDisabled(actor: SessionUser, userId: string, disabled: boolean) {
  authorizeAdmin(actor, "admin.users");
  if (disabled && userId === actor.id) {
    throw new AppError("conflict", "You cannot disable your own account. Ask another administrator.");
  }
  if (!z.uuid().safeParse(userId).success) throw notFound("Person");
  return transaction(async (tx) => {
    const [before] = await tx.select().from(users).where(eq(users.id, userId)).for("update");
    if (!before) throw notFound("Person");
    const [after] = await tx
      .update(users)
      .set({ disabledAt: disabled ? (before.disabledAt ?? sql`now()`) : null, updatedAt: new Date() })
      .where(eq(users.id, userId))
      .returning({ id: users.id, disabledAt: users.disabledAt });
    if (disabled) await bumpSessionVersion(tx, userId);
    await writeAudit(tx, {
      projectId: null,
      userId: actor.id,
      recordType: "user",
      recordId: userId,
      action: disabled ? "disable" : "enable",
      before: { disabledAt: before.disabledAt },
      after: { disabledAt: after.disabledAt },
    });
    return { id: after.id, disabled: after.disabledAt !== null };
  });
}

export type AccountSettings = AccountSettingsInput;

/** The settings row, or the defaults before an administrator has saved any. */
export async function readAccountSettings(): Promise<AccountSettings> {
  const [row] = await db.select().from(accountSettings).where(eq(accountSettings.id, 1));
  return {
    idleTimeoutMinutes: row?.idleTimeoutMinutes ?? DEFAULT_IDLE_TIMEOUT_MINUTES,
    offlineWindowHours: row?.offlineWindowHours ?? DEFAULT_OFFLINE_WINDOW_HOURS,
  };
}

export async function updateAccountSettings(actor: SessionUser, input: AccountSettingsInput): Promise<AccountSettings> {
  authorizeAdmin(actor, "admin.users");
  return transaction(async (tx) => {
    const before = await readAccountSettings();
    await tx
      .insert(accountSettings)
      .values({ id: 1, ...input })
      .onConflictDoUpdate({ target: accountSettings.id, set: { ...input, updatedAt: new Date() } });
    await writeAudit(tx, { projectId: null, userId: actor.id, recordType: "account-settings", action: "update", before, after: input });
    return input;
  });
}
