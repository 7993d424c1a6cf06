// The data one digest is built from: a project and one project-local date, as load.ts reads it.
// Values are SI as stored; the builder formats them in the project's unit system.
import type { CheckInput, CheckMix } from "@/lib/checks";
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

export type DigestDelivery = {
  id: string;
  placementId: string;
  ticketNumber: string;
  truck: string;
  volumeM3: number;
  batchedAt: Date;
  arrivedAt: Date;
  dischargeFinishedAt: Date | null;
  revolutions: number | null;
  waterAddedL: number | null;
  waterFirstAt: Date | null;
  waterLastAt: Date | null;
  waterAddedBy: string | null;
  waterAuthorisedBy: string | null;
  status: "accepted" | "rejected";
  rejectReason: string | null;
};

export type DigestFieldTest = {
  id: string;
  placementId: string;
  deliveryId: string | null;
  sampledAt: Date;
  slumpMm: number | null;
  airPct: number | null;
  concreteTempC: number | null;
};

export type DigestWeather = {
  placementId: string | null;
  observedAt: Date;
  airTempC: number;
  relativeHumidityPct: number;
  windKmh: number;
  concreteTempC: number | null;
  evaporationKgM2H: number | null;
};

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
};
