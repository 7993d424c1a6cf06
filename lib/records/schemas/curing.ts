import { z } from "zod";
import { clientId, pastInstant, optionalText, recordId, requiredText, temperatureC } from "./fields";

export const curingFields = {
  method: requiredText("Curing method", 80),
  readAt: pastInstant("Reading time"),
  tempC: temperatureC("Temperature"),
  location: optionalText("Location", 120),
  note: optionalText("Note", 1_000).nullable(),
};
export const curingCreateSchema = z
  .object({ id: clientId, placementId: recordId("Placement"), ...curingFields })
  .partial({ location: true, note: true });
export const curingUpdateSchema = z.object(curingFields).partial();

/** What the server fills in when a create leaves a field out (db/schema/curing.ts). */
export const curingDefaults = z.object({ location: curingFields.location.default("") });
