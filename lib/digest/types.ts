// The data one digest is built from: a project and one project-local date, as load.ts reads it.
// Values are SI as stored; the builder formats them in the project's unit system.
import type { SiteStatus } from "./site-status";
import type { CheckDelivery, CheckFieldTest, CheckInput, CheckMix, CheckWeather } from "@/lib/checks";
import type { UnitSystem } from "@/lib/concrete/units";
import type { PlacementState } from "@/lib/records/enums";

export type DigestProject = {
  id: string;
  name: string;
  code: string;
  timeZone: string;
  unitSystem: UnitSystem;
  dischargeLimitMinutes: number;
  revolutionLimit: number | null;
  evaporationHighKgM2H: number | null;
  maxConcreteTempC: number;
  coldWeatherDefinition: "aci306r-current" | "aci306-1990";
  specEditions: string;
};

/** The mix as the rulebook reads it (lib/checks): one description of a mix for every surface. */
export type DigestMix = CheckMix;

export type DigestPlacement = {
  id: string;
  element: string;
  level: string;
  grid: string;
  leastDimensionMm: number | null;
  plannedVolumeM3: number | null;
  plannedStart: Date;
  state: PlacementState;
  holdReason: string | null;
  signedAt: Date | null;
  signedByName: string | null;
  mix: DigestMix | null;
};

/** A truck ticket as the rulebook reads it, with who added water and why a load was rejected. */
export type DigestDelivery = Omit<CheckDelivery, "dischargeStartedAt"> & {
  waterAddedBy: string | null;
  waterAuthorisedBy: string | null;
  rejectReason: string | null;
};

export type DigestFieldTest = CheckFieldTest;

/** A weather reading as the rulebook reads it, with the evaporation rate the server stored. */
export type DigestWeather = Omit<CheckWeather, "id"> & { evaporationKgM2H: number | null };

export type DigestSpecimenSet = {
  id: string;
  placementId: string;
  setCode: string;
  castAt: Date;
  count: number;
  cylinderDiameterMm: number;
  cylinderLengthMm: number;
  testAgesDays: number[];
};

export type DigestBreak = {
  specimenSetId: string;
  setCode: string;
  placementId: string;
  cylinderDiameterMm: number;
  testedAt: Date;
  ageDays: number;
  strengthMPa: number;
};

export type DigestDiary = {
  submitted: boolean;
  weatherSummary: string;
  workDone: string;
  crew: { trade: string; count: number }[];
  delays: { cause: string; minutes: number; description: string }[];
};

export type DigestPhoto = { id: string; caption: string; takenAt: Date | null; recordType: string };

export type DigestDay = {
  project: DigestProject;
  /** Project-local calendar date, YYYY-MM-DD. */
  date: string;
  /** Placements planned to start on the date. */
  placements: DigestPlacement[];
  /** Earlier placements that the day's trucks, tests, specimens or breaks belong to. */
  otherPlacements: DigestPlacement[];
  deliveries: DigestDelivery[];
  fieldTests: DigestFieldTest[];
  weather: DigestWeather[];
  /** What the rulebook judges for the day (lib/findings/load): the same input as the stored findings. */
  checks: CheckInput;
  specimenSets: DigestSpecimenSet[];
  breaks: DigestBreak[];
  diary: DigestDiary | null;
  photos: DigestPhoto[];
  /** Holds in effect, open findings of site visits and the diary's safety notes (lib/digest/site-status.ts). */
  site?: SiteStatus;
};
