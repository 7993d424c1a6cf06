// The digest's warnings: each applies a rule from lib/concrete to the day's records and says which
// rule it applied. Pure functions over the loaded day (types.ts); formatting in the project's units.
import type { DigestDelivery, DigestPlacement } from "./types";

export type DigestWarning = {
  tone: "danger" | "caution";
  kind: "late-truck" | "revolutions" | "water" | "test" | "evaporation" | "cold" | "low-strength";
  title: string;
  detail: string;
  /** The rule applied and where it comes from. */
  rule: string;
};

export const GOVERNS = "The project's specification governs over these defaults.";

export type Lookup = { placement: (id: string | null) => DigestPlacement | undefined; time: (d: Date) => string };

export const placementName = (p: DigestPlacement | undefined) => (p ? p.element : "the site");
export const truckName = (d: DigestDelivery) => `ticket ${d.ticketNumber}${d.truck ? ` (truck ${d.truck})` : ""}`;
