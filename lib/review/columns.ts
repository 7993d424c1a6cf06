// Column keys and labels of the review tables, shared by the screen and the CSV export
// (client-safe: no database imports). A measured column names its quantity and the digits the
// screen shows, so the table and the CSV round alike (lib/concrete/units.ts formats both).
import type { Quantity } from "@/lib/concrete/units";

export type MeasuredColumn = { quantity: Quantity; digits?: number };

/** The placements table's measured columns: stored SI, shown in the project's units. */
export const PLACEMENT_MEASURES = {
  orderedM3: { quantity: "volume", digits: 1 },
  placedM3: { quantity: "volume", digits: 1 },
  waterAddedL: { quantity: "waterVolume" },
} as const satisfies Record<string, MeasuredColumn>;
export const PLACEMENT_COLUMNS = [
  { key: "date", label: "Date" },
  { key: "project", label: "Project" },
  { key: "element", label: "Element" },
  { key: "mix", label: "Mix" },
  { key: "orderedM3", label: "Ordered" },
  { key: "placedM3", label: "Placed" },
  { key: "trucks", label: "Trucks" },
  { key: "lateTrucks", label: "Late trucks" },
  { key: "waterAddedL", label: "Water added" },
  { key: "testsOut", label: "Out-of-tolerance tests" },
  { key: "evaporationRisk", label: "Highest evaporation risk" },
  { key: "state", label: "State" },
  { key: "signedBy", label: "Signed by" },
] as const;
export type PlacementColumnKey = (typeof PLACEMENT_COLUMNS)[number]["key"];

export const DIARY_COLUMNS = [
  { key: "date", label: "Date" },
  { key: "project", label: "Project" },
  { key: "state", label: "Diary" },
  { key: "placements", label: "Placements" },
  { key: "crew", label: "Crew" },
  { key: "delayMinutes", label: "Delays (min)" },
  { key: "submittedBy", label: "Submitted by" },
] as const;
export type DiaryColumnKey = (typeof DIARY_COLUMNS)[number]["key"];
