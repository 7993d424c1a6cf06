import { z } from "zod";
import { CHECKLIST_ANSWERS, CHECKLIST_KINDS } from "@/lib/records/enums";
import { choice, clientId, optionalText, recordId, requiredText } from "./fields";

export const checklistFields = { kind: choice("Checklist kind", CHECKLIST_KINDS) };
export const checklistCreateSchema = z.object({ id: clientId, placementId: recordId("Placement"), ...checklistFields });
export const checklistUpdateSchema = z.object(checklistFields).partial();

export const checklistItemFields = {
  itemKey: requiredText("Item key", 60),
  label: requiredText("Item", 200),
  answer: choice("Answer", CHECKLIST_ANSWERS).nullable(),
  note: optionalText("Note", 1_000).nullable(),
};
export const checklistItemCreateSchema = z
  .object({ id: clientId, checklistId: recordId("Checklist"), ...checklistItemFields })
  .partial({ answer: true, note: true });
export const checklistItemUpdateSchema = z.object(checklistItemFields).partial();

/** What the server fills in when a create leaves a field out. */
export const checklistDefaults = z.object({});
export const checklistItemDefaults = z.object({
  answer: checklistItemFields.answer.default(null),
  note: checklistItemFields.note.default(null),
});
