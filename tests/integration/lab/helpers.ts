// Shared by the lab's integration tests: the demo project and people, and time steps.
import { DEMO_IDS } from "@/scripts/seed/ids";
import { type TestUser } from "../helpers";

export const LARKSPUR = DEMO_IDS.projects.larkspur;
export const olu: TestUser = { id: DEMO_IDS.users.olu, email: "olu.office@example.test", name: "Olu Adeyemi", isAdmin: false };
export const oona: TestUser = { id: DEMO_IDS.users.oona, email: "oona.owner@example.test", name: "Oona Lindqvist", isAdmin: false };
export const DAY_MS = 86_400_000;
export const HOUR_MS = 3_600_000;
