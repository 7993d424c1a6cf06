// Column keys and labels of the review tables, shared by the screen and the CSV export
// (client-safe: no database imports).
export const PLACEMENT_COLUMNS = [
  { key: "date", label: "Date" },
  { key: "project", label: "Project" },
  { key: "element", label: "Element" },
  { key: "mix", label: "Mix" },
  { key: "orderedM3", label: "Ordered (m³)" },
  { key: "placedM3", label: "Placed (m³)" },
  { key: "trucks", label: "Trucks" },
  { key: "lateTrucks", label: "Late trucks" },
  { key: "waterAddedL", label: "Water added (L)" },
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
