import { z } from "zod";
import { clientId, pastInstant, measure, optionalText, recordId, temperatureC } from "./fields";

export const fieldTestFields = {
  deliveryId: recordId("Delivery").nullable(),
  sampledAt: pastInstant("Sampling time"),
  slumpMm: measure("Slump", 0, 300, "mm").nullable(),
  slumpFlowMm: measure("Slump flow", 0, 1_000, "mm").nullable(),
  airPct: measure("Air content", 0, 20, "%").nullable(),
  concreteTempC: temperatureC("Concrete temperature").nullable(),
  airTempC: temperatureC("Air temperature").nullable(),
  densityKgM3: measure("Density", 500, 4_000, "kg/m³").nullable(),
  notes: optionalText("Notes", 2_000).nullable(),
  testedBy: optionalText("Tested by", 120).nullable(),
};

const RESULTS = ["slumpMm", "slumpFlowMm", "airPct", "concreteTempC", "densityKgM3"] as const;

export const fieldTestCreateSchema = z
  .object({ id: clientId, placementId: recordId("Placement"), ...fieldTestFields })
  .partial({
    deliveryId: true,
    slumpMm: true,
    slumpFlowMm: true,
    airPct: true,
    concreteTempC: true,
    airTempC: true,
    densityKgM3: true,
    notes: true,
    testedBy: true,
  })
  .superRefine((v, ctx) => {
    if (RESULTS.every((key) => v[key] === undefined || v[key] === null)) {
      ctx.addIssue({
        code: "custom",
        path: ["slumpMm"],
        message: "Enter at least one result: slump, slump flow, air, concrete temperature or density",
      });
    }
  });

export const fieldTestUpdateSchema = z.object(fieldTestFields).partial();

export type FieldTestInput = z.input<typeof fieldTestCreateSchema>;

/** What the server fills in when a create leaves a field out. */
export const fieldTestDefaults = z.object({ deliveryId: fieldTestFields.deliveryId.default(null) });
