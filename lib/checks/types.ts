// The rulebook's vocabulary: what a check reads (records as stored, SI with units in the names)
// and what it returns (a finding). Pure types; no framework, no database.
import type { UnitSystem } from "@/lib/concrete/units";

/** How much a finding asks of the person: note it, watch it, act on it. */
export const SEVERITIES = ["info", "caution", "warning"] as const;
export type Severity = (typeof SEVERITIES)[number];

/** Where a rule comes from, and how sure we are of the text. */
export type Source = {
  document: string;
  edition?: string;
  clause?: string;
  /**
   * published: seen in the published text; memory: recalled, not checked against the text;
   * product: this product's own choice (a caution band), not a published limit;
   * project: the project specification's own value; practice: common trade practice.
   */
  basis: "published" | "memory" | "product" | "project" | "practice";
};

/** The number a finding judged and the limit it was judged against, in the project's units. */
export type Applied = { value: number | null; limit: number | null; unit: string };

export const RULES = [
  "evaporation",
  "hot-weather",
  "cold-weather",
  "curing-temperature",
  "freeze-protection",
  "discharge-time",
  "discharge-elapsed",
  "revolutions",
  "site-water",
  "mix-code",
  "slump",
  "air-content",
  "concrete-temperature",
  "strength-low",
  "strength-incomplete",
  "strength-acceptance",
  "sampling-frequency",
  "maturity-target",
  "maturity-cold",
  "maturity-gap",
] as const;
export type RuleId = (typeof RULES)[number];

/** The record a finding is about; a day-level finding names the project-local date. */
export type Subject =
  | { type: "weather" | "delivery" | "field-test" | "curing" | "strength-test" | "placement" | "sensor"; id: string }
  | { type: "day"; id: string };

export type Finding = {
  rule: RuleId;
  severity: Severity;
  subject: Subject;
  /** The placement the finding concerns; null for a site-wide or day-level finding. */
  placementId: string | null;
  /** When the judged reading was taken (ISO instant); groups findings by project-local day. */
  at: string;
  /** One line: what was found, with the value and its unit. */
  title: string;
  /** What the rule says and what to do, in the person's words. */
  message: string;
  applied: Applied;
  source: Source;
  /** Always shown beside the finding. */
  governs: string;
};

export const GOVERNS =
  "The project specification, local codes and the engineer of record govern over these defaults.";

/** Identity of a finding across surfaces: the same rule on the same record at the same severity. */
export const findingKey = (f: Pick<Finding, "rule" | "subject" | "severity">): string =>
  `${f.rule}:${f.subject.type}:${f.subject.id}:${f.severity}`;

// ---- What the checks read: records as stored (SI), with the project's settings and the mix ----

export type ColdWeatherDefinition = "aci306r-current" | "aci306-1990";

export type CheckProject = {
  unitSystem: UnitSystem;
  timeZone: string;
  /** ASTM C94 default 90; the project specification may shorten or waive it. */
  dischargeLimitMinutes: number;
  /** Only when the order states one (ASTM C94-17a). */
  revolutionLimit: number | null;
  /** Project specification's evaporation limit, stored in kg/m²/h; null = the published default. */
  evaporationHighKgM2H: number | null;
  maxConcreteTempC: number;
  coldWeatherDefinition: ColdWeatherDefinition;
};

export type CheckMix = {
  code: string;
  fcMPa: number;
  fcAgeDays: number;
  slumpTargetMm: number | null;
  slumpType: "target" | "maximum";
  slumpToleranceMm: number | null;
  airTargetPct: number | null;
  airTolerancePct: number | null;
  maxConcreteTempC: number | null;
  siteWaterAllowedLPerM3: number;
  lowBleed: boolean;
};

export type CheckPlacement = {
  id: string;
  element: string;
  leastDimensionMm: number | null;
  plannedVolumeM3: number | null;
  plannedStart: Date;
  mix: CheckMix | null;
};

export type CheckDelivery = {
  id: string;
  placementId: string;
  ticketNumber: string;
  truck: string;
  volumeM3: number;
  /** The mix code printed on the ticket; null when not entered. */
  mixCode: string | null;
  batchedAt: Date;
  arrivedAt: Date;
  dischargeStartedAt: Date | null;
  dischargeFinishedAt: Date | null;
  revolutions: number | null;
  waterAddedL: number | null;
  waterFirstAt: Date | null;
  waterLastAt: Date | null;
  status: "accepted" | "rejected";
};

export type CheckFieldTest = {
  id: string;
  placementId: string;
  deliveryId: string | null;
  sampledAt: Date;
  slumpMm: number | null;
  airPct: number | null;
  concreteTempC: number | null;
};

export type CheckWeather = {
  id: string;
  placementId: string | null;
  observedAt: Date;
  airTempC: number;
  relativeHumidityPct: number;
  windKmh: number;
  concreteTempC: number | null;
};

export type CheckCuring = {
  id: string;
  placementId: string;
  readAt: Date;
  tempC: number;
};

export type CheckSpecimenSet = {
  id: string;
  placementId: string;
  setCode: string;
  castAt: Date;
  cylinderDiameterMm: number;
};

export type CheckBreak = {
  id: string;
  specimenSetId: string;
  testedAt: Date;
  ageDays: number;
  strengthMPa: number;
};

/** Everything the rulebook reads about one project: any subset of its records. */
export type CheckInput = {
  project: CheckProject;
  placements: CheckPlacement[];
  deliveries: CheckDelivery[];
  fieldTests: CheckFieldTest[];
  weather: CheckWeather[];
  curing: CheckCuring[];
  specimenSets: CheckSpecimenSet[];
  breaks: CheckBreak[];
};

/** Where a finding's rule comes from, as one line: "ASTM C94 §10.7", "ACI 306.1-90 [from memory]". */
export function citation(source: Source): string {
  const name = [source.document + (source.edition ? `-${source.edition}` : ""), source.clause].filter(Boolean).join(" ");
  const basis = { published: "", memory: " [from memory, not checked against the text]", product: " (this product's own choice, not a published limit)", project: "", practice: " (common practice)" }[source.basis];
  return `${name}${basis}`;
}
