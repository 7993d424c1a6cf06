import { z } from "zod";
import { calendarDate, clientId, measure, optionalText, recordId, requiredText, wholeNumber } from "./fields";

export const diaryEntryFields = {
  date: calendarDate("Date"),
  weatherSummary: optionalText("Weather summary", 500),
  workDone: optionalText("Work done", 5_000),
  safetyNotes: optionalText("Safety notes", 2_000),
};
export const diaryEntryCreateSchema = z
  .object({ id: clientId, ...diaryEntryFields })
  .partial({ weatherSummary: true, workDone: true, safetyNotes: true });
export const diaryEntryUpdateSchema = z.object(diaryEntryFields).partial();

const entryId = recordId("Diary entry");

export const diaryCrewFields = { trade: requiredText("Trade", 80), count: wholeNumber("Crew count", 0, 500) };
export const diaryCrewCreateSchema = z.object({ id: clientId, diaryEntryId: entryId, ...diaryCrewFields });
export const diaryCrewUpdateSchema = z.object(diaryCrewFields).partial();

export const diaryEquipmentFields = {
  name: requiredText("Equipment", 80),
  count: wholeNumber("Equipment count", 0, 100).nullable(),
  hours: measure("Hours", 0, 1_000, "h").nullable(),
};
export const diaryEquipmentCreateSchema = z
  .object({ id: clientId, diaryEntryId: entryId, ...diaryEquipmentFields })
  .partial({ count: true, hours: true });
export const diaryEquipmentUpdateSchema = z.object(diaryEquipmentFields).partial();

export const diaryDelayFields = {
  cause: requiredText("Cause of the delay", 80),
  minutes: wholeNumber("Delay", 0, 1_440, "minutes"),
  description: optionalText("Description", 1_000),
};
export const diaryDelayCreateSchema = z
  .object({ id: clientId, diaryEntryId: entryId, ...diaryDelayFields })
  .partial({ description: true });
export const diaryDelayUpdateSchema = z.object(diaryDelayFields).partial();

export const diaryVisitorFields = {
  name: requiredText("Visitor's name", 120),
  company: optionalText("Company", 120),
  purpose: optionalText("Purpose", 300),
};
export const diaryVisitorCreateSchema = z
  .object({ id: clientId, diaryEntryId: entryId, ...diaryVisitorFields })
  .partial({ company: true, purpose: true });
export const diaryVisitorUpdateSchema = z.object(diaryVisitorFields).partial();

// What the server fills in when a create leaves a field out (db/schema/diary.ts).
export const diaryEntryDefaults = z.object({
  weatherSummary: diaryEntryFields.weatherSummary.default(""),
  workDone: diaryEntryFields.workDone.default(""),
  safetyNotes: diaryEntryFields.safetyNotes.default(""),
});
export const diaryCrewDefaults = z.object({});
export const diaryEquipmentDefaults = z.object({
  count: diaryEquipmentFields.count.default(null),
  hours: diaryEquipmentFields.hours.default(null),
});
export const diaryDelayDefaults = z.object({ description: diaryDelayFields.description.default("") });
export const diaryVisitorDefaults = z.object({
  company: diaryVisitorFields.company.default(""),
  purpose: diaryVisitorFields.purpose.default(""),
});
