import { z } from "zod";
import { FINDING_SEVERITIES, FINDING_STATES, SITE_VISIT_STATES } from "@/lib/records/enums";
import { calendarDate, choice, clientId, instant, optionalText, ordered, recordId, requiredText, serverOwned } from "./fields";

const MAX_VISIT_PLACEMENTS = 50;

export const siteVisitFields = {
  visitDate: calendarDate("Visit date"),
  arrivedAt: instant("Time on site from").nullable(),
  leftAt: instant("Time on site to").nullable(),
  areasInspected: optionalText("Areas inspected", 2_000),
  elementsInspected: optionalText("Elements inspected", 2_000),
  testsWitnessed: optionalText("Tests witnessed", 2_000),
  weather: optionalText("Weather", 300),
  notes: optionalText("Notes", 5_000),
  placementIds: z
    .array(recordId("Placement"), { error: "Placements must be a list of placement ids" })
    .max(MAX_VISIT_PLACEMENTS, `Link at most ${MAX_VISIT_PLACEMENTS} placements to one visit`)
    .refine((ids) => new Set(ids).size === ids.length, "Each placement can be linked once"),
};

const OPTIONAL_VISIT = {
  arrivedAt: true,
  leftAt: true,
  areasInspected: true,
  elementsInspected: true,
  testsWitnessed: true,
  weather: true,
  notes: true,
  placementIds: true,
} as const;

export const siteVisitCreateSchema = z
  .object({ id: clientId, ...siteVisitFields })
  .partial(OPTIONAL_VISIT)
  .superRefine((v, ctx) => ordered(ctx, v.arrivedAt, v.leftAt, "leftAt", "The time you left must be after the time you arrived"));

export const siteVisitUpdateSchema = z.object(siteVisitFields).partial().extend({
  state: z.never({ error: "Submit or sign the report with its own action, not by editing it" }).optional(),
});

export const findingFields = {
  placementId: recordId("Placement").nullable(),
  description: requiredText("What does not conform", 2_000),
  location: optionalText("Where", 200),
  severity: choice("Severity", FINDING_SEVERITIES),
  requirement: optionalText("Requirement", 300),
  actionRequired: optionalText("Action required", 2_000),
  dueDate: calendarDate("Due date").nullable(),
};

export const findingCreateSchema = z
  .object({ id: clientId, siteVisitId: recordId("Site visit"), ...findingFields })
  .partial({ placementId: true, location: true, requirement: true, actionRequired: true, dueDate: true });

export const findingUpdateSchema = z.object(findingFields).partial().extend({
  state: z.never({ error: "Answer, close or reopen a finding with its own action, not by editing it" }).optional(),
  response: z.never({ error: "The superintendent answers a finding with the answer action" }).optional(),
});

export type SiteVisitInput = z.input<typeof siteVisitCreateSchema>;
export type FindingInput = z.input<typeof findingCreateSchema>;

/** What the server fills in when a create leaves a field out (db/schema/site-visits.ts); a new visit is a draft. */
export const siteVisitDefaults = z.object({
  arrivedAt: siteVisitFields.arrivedAt.default(null),
  leftAt: siteVisitFields.leftAt.default(null),
  areasInspected: siteVisitFields.areasInspected.default(""),
  elementsInspected: siteVisitFields.elementsInspected.default(""),
  testsWitnessed: siteVisitFields.testsWitnessed.default(""),
  weather: siteVisitFields.weather.default(""),
  notes: siteVisitFields.notes.default(""),
  placementIds: siteVisitFields.placementIds.default([]),
  state: z.enum(SITE_VISIT_STATES).default("draft"),
  submittedAt: serverOwned.instant(),
  signedAt: serverOwned.instant(),
  signedBy: serverOwned.id(),
});

/** A new finding is open and unanswered. */
export const findingDefaults = z.object({
  placementId: findingFields.placementId.default(null),
  location: findingFields.location.default(""),
  requirement: findingFields.requirement.default(""),
  actionRequired: findingFields.actionRequired.default(""),
  dueDate: findingFields.dueDate.default(null),
  state: z.enum(FINDING_STATES).default("open"),
  response: serverOwned.text(),
  answeredAt: serverOwned.instant(),
  answeredBy: serverOwned.id(),
  closedAt: serverOwned.instant(),
  closedBy: serverOwned.id(),
  closeNote: serverOwned.text(),
  reopenedAt: serverOwned.instant(),
  reopenedBy: serverOwned.id(),
  reopenReason: serverOwned.text(),
});
