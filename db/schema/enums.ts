// Value lists shared by the database schema, the zod schemas and the screens. No imports, so a
// client component can use them (through lib/records/enums.ts) without pulling in the database layer.

export const PLACEMENT_STATES = ["planned", "ready", "cleared", "placing", "placed", "signed", "held"] as const;
export type PlacementState = (typeof PLACEMENT_STATES)[number];

export const ELEMENT_TYPES = ["footing", "wall", "column", "beam", "slab-on-ground", "elevated-slab", "other"] as const;
export type ElementType = (typeof ELEMENT_TYPES)[number];

export const SLUMP_TYPES = ["target", "maximum"] as const;
export const DELIVERY_STATUSES = ["accepted", "rejected"] as const;
export const SUN_EXPOSURES = ["sun", "shade", "overcast"] as const;
export const CHECKLIST_KINDS = ["readiness", "hot-weather", "cold-weather"] as const;
export const CHECKLIST_ANSWERS = ["yes", "no", "na"] as const;
export const STRENGTH_AGES_DAYS = [28, 56] as const;
export const CYLINDER_DIAMETERS_MM = [100, 150] as const;

// The inspection log (site visits and their findings, lib/site-visits).
export const SITE_VISIT_STATES = ["draft", "submitted", "signed"] as const;
export type SiteVisitState = (typeof SITE_VISIT_STATES)[number];
export const FINDING_STATES = ["open", "answered", "closed"] as const;
export type FindingState = (typeof FINDING_STATES)[number];
/** Our own plain words: minor (fix in the normal course), major (fix before work continues there), critical (stop that work now). */
export const FINDING_SEVERITIES = ["minor", "major", "critical"] as const;
export type FindingSeverity = (typeof FINDING_SEVERITIES)[number];

// Temperature sensors and their readings (maturity method, lib/concrete/maturity*).
export const READING_SOURCES = ["manual", "import"] as const;
export const MATURITY_METHODS = ["nurse-saul", "equivalent-age"] as const;
/** Readings per stored batch: an imported logger file is split into batches of this size. */
export const MAX_READINGS_PER_BATCH = 1_000;
