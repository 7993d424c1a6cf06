// The demo scenario's fixed ids, people and projects (invented; PRODUCT.md "Demo scenario"), and
// the helpers its records are written with. Data only: the seed, the scripts and the tests read it.
import { psiToMPa } from "@/lib/concrete/units";
import { wallClockInstants } from "@/lib/time/zone";

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

export type DemoRecord = {
  projectId: string;
  by: string;
  recordedAt: Date;
  /** The record's create input (the same schema the app validates). */
  values: Record<string, unknown>;
  /** Columns outside the create schema (state, hold reason, diary submission). */
  extra?: Record<string, unknown>;
  signedAt?: Date;
  signedBy?: string;
};

/** Fixed ids: 5eed0000-0000-4000-8000-<n in hex>. */
export const demoId = (n: number) => `5eed0000-0000-4000-8000-${n.toString(16).padStart(12, "0")}`;

/** A wall-clock time on the site (America/Chicago) as an instant (the first, where clocks go back). */
export function chicago(day: string, time: string): Date {
  const [year, month, date] = day.split("-").map(Number);
  const [hour, minute] = time.split(":").map(Number);
  const { instants } = wallClockInstants({ year, month, day: date, hour, minute, second: 0 }, "America/Chicago");
  if (instants.length === 0) throw new RangeError(`${day} ${time} does not exist in Chicago (clocks went forward)`);
  return new Date(instants[0]);
}
