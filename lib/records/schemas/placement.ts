import { z } from "zod";
import { ELEMENT_TYPES, PLACEMENT_STATES } from "@/lib/records/enums";
import { choice, clientId, instant, measure, optionalText, recordId, requiredText, serverOwned } from "./fields";

export const placementFields = {
  element: requiredText("Element", 120),
  level: optionalText("Level", 60),
  grid: optionalText("Grid", 60),
  elementType: choice("Element type", ELEMENT_TYPES),
  leastDimensionMm: measure("Least dimension", 25, 10_000, "mm").nullable(),
  plannedVolumeM3: measure("Planned volume", 0, 5_000, "m³").nullable(),
  mixId: recordId("Mix").nullable(),
  plannedStart: instant("Planned start"),
};

export const placementCreateSchema = z
  .object({ id: clientId, ...placementFields })
  .partial({ level: true, grid: true, leastDimensionMm: true, plannedVolumeM3: true, mixId: true });

export const placementUpdateSchema = z.object(placementFields).partial().extend({
  // The state is changed only through the workflow, which knows who may do what.
  state: z
    .never({ error: "Change the state with a transition (ready, cleared, held …), not by editing the placement" })
    .optional(),
});

export type PlacementInput = z.input<typeof placementCreateSchema>;

/** What the server fills in when a create leaves a field out (db/schema/placements.ts); a new placement is planned. */
export const placementDefaults = z.object({
  level: placementFields.level.default(""),
  grid: placementFields.grid.default(""),
  state: z.enum(PLACEMENT_STATES).default("planned"),
  leastDimensionMm: placementFields.leastDimensionMm.default(null),
  plannedVolumeM3: placementFields.plannedVolumeM3.default(null),
  mixId: placementFields.mixId.default(null),
});

/** Fields only the workflow writes (a hold, the sign-off), as the device stores them; null until then. */
export const placementServerWritten = z.object({
  holdReason: serverOwned.text(),
  signedAt: serverOwned.instant(),
  signedBy: serverOwned.id(),
});
