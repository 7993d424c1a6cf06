// The synced record types, in a module with no dependencies so browser code can import it
// without pulling in the server's table definitions.
export const RECORD_TYPES = [
  "mix-designs",
  "placements",
  "deliveries",
  "field-tests",
  "specimen-sets",
  "breaks",
  "weather-observations",
  "checklists",
  "checklist-items",
  "curing-readings",
  "diary-entries",
  "diary-crew",
  "diary-equipment",
  "diary-delays",
  "diary-visitors",
  "site-visits",
  "findings",
  "photos",
  "temperature-sensors",
  "sensor-readings",
] as const;
export type RecordType = (typeof RECORD_TYPES)[number];
