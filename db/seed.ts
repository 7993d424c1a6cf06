// The invented demo scenario (see the product brief): Kestrel & Vine Constructors build
// Larkspur Commons and the Millrace Pump House. Idempotent: running it twice changes nothing.
import { hashPassword } from "@/lib/auth/password";
import { psiToMPa } from "@/lib/concrete/units";
import type { ProjectRole } from "@/lib/auth/roles";
import type { Database } from "./index";
import { memberships, projects, users } from "./schema";
import { seedRecords } from "./seed-records";

export const DEMO_PASSWORD = "placewright-demo";

export const DEMO_IDS = {
  users: {
    sam: "0b7d2a51-5c1e-4f0a-9a55-000000000001",
    ines: "0b7d2a51-5c1e-4f0a-9a55-000000000002",
    olu: "0b7d2a51-5c1e-4f0a-9a55-000000000003",
    oona: "0b7d2a51-5c1e-4f0a-9a55-000000000004",
    ada: "0b7d2a51-5c1e-4f0a-9a55-000000000005",
  },
  projects: {
    larkspur: "6f1c3e20-8d44-4b7e-b1a2-00000000000a",
    millrace: "6f1c3e20-8d44-4b7e-b1a2-00000000000b",
  },
} as const;

export const DEMO_USERS = [
  { id: DEMO_IDS.users.sam, email: "sam.super@example.test", name: "Sam Okafor", isAdmin: false },
  { id: DEMO_IDS.users.ines, email: "ines.inspect@example.test", name: "Ines Marchetti", isAdmin: false },
  { id: DEMO_IDS.users.olu, email: "olu.office@example.test", name: "Olu Adeyemi", isAdmin: false },
  { id: DEMO_IDS.users.oona, email: "oona.owner@example.test", name: "Oona Lindqvist", isAdmin: false },
  { id: DEMO_IDS.users.ada, email: "ada.admin@example.test", name: "Ada Brennan", isAdmin: true },
];

export const DEMO_PROJECTS = [
  {
    id: DEMO_IDS.projects.larkspur,
    name: "Larkspur Commons",
    code: "LC-01",
    siteAddress: "1400 Larkspur Avenue, Riverbend (invented)",
    timeZone: "America/Chicago",
    unitSystem: "IP" as const,
    specEditions: "ACI 318-19, ACI 301-20, ACI 305.1-14, ACI 306.1-90, ASTM C94-21",
    // The project specification's stripping strength for elevated decks (invented): 3000 psi.
    maturityTargetMPa: psiToMPa(3000),
  },
  {
    id: DEMO_IDS.projects.millrace,
    name: "Millrace Pump House",
    code: "MPH-02",
    siteAddress: "Millrace Road, Riverbend (invented)",
    timeZone: "America/Chicago",
    unitSystem: "SI" as const,
    specEditions: "ACI 318-19, ACI 306R-16",
  },
];

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
