// The invented demo scenario (see the product brief): Kestrel & Vine Constructors build
// Larkspur Commons and the Millrace Pump House. Idempotent: running it twice changes nothing.
import { hashPassword } from "@/lib/auth/password";
import type { ProjectRole } from "@/lib/auth/roles";
import type { Database } from "@/db";
import { memberships, projects, users } from "@/db/schema";
import { DEMO_IDS, DEMO_PASSWORD, DEMO_PROJECTS, DEMO_USERS } from "./ids";
import { seedRecords } from "./records";

const MEMBERSHIPS: { user: keyof typeof DEMO_IDS.users; project: keyof typeof DEMO_IDS.projects; role: ProjectRole }[] = [
  { user: "sam", project: "larkspur", role: "superintendent" },
  { user: "sam", project: "millrace", role: "superintendent" },
  { user: "ines", project: "larkspur", role: "inspector" },
  { user: "ines", project: "millrace", role: "inspector" },
  { user: "olu", project: "larkspur", role: "office" },
  { user: "olu", project: "millrace", role: "office" },
  { user: "oona", project: "larkspur", role: "owner" },
];

export async function seedFoundation(db: Database): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (tx) => {
    // Existing rows are left alone (a demo user may have changed their password).
    await tx.insert(users).values(DEMO_USERS.map((u) => ({ ...u, passwordHash }))).onConflictDoNothing();
    await tx.insert(projects).values(DEMO_PROJECTS).onConflictDoNothing();
    await tx
      .insert(memberships)
      .values(MEMBERSHIPS.map((m) => ({ userId: DEMO_IDS.users[m.user], projectId: DEMO_IDS.projects[m.project], role: m.role })))
      .onConflictDoNothing();
  });
}

/** Every part of the demo scenario, in dependency order. */
export async function seedDemo(db: Database): Promise<void> {
  await seedFoundation(db);
  await seedRecords(db);
}
