import { z } from "zod";
import { CYLINDER_DIAMETERS_MM } from "@/lib/records/enums";
import { clientId, instant, measure, recordId, requiredText, temperatureC, wholeNumber } from "./fields";

export const specimenSetFields = {
  deliveryId: recordId("Delivery").nullable(),
  setCode: requiredText("Set id", 40),
  cylinderDiameterMm: z.literal(CYLINDER_DIAMETERS_MM, { error: "Cylinder diameter must be 100 or 150 mm" }),
  cylinderLengthMm: measure("Cylinder length", 100, 400, "mm"),
  count: wholeNumber("Number of cylinders", 1, 24),
  castAt: instant("Cast time"),
  initialCuringMinC: temperatureC("Lowest initial-curing temperature").nullable(),
  initialCuringMaxC: temperatureC("Highest initial-curing temperature").nullable(),
  /** The logger cured with the set; null: standard curing (lib/maturity/set-maturity.ts). */
  sensorId: recordId("Temperature sensor").nullable(),
  testAgesDays: z
    .array(wholeNumber("Test age", 1, 365, "days"), { error: "Test ages must be a list of days, like 7, 28" })
    .min(1, "Enter at least one test age")
    .max(10, "At most 10 test ages"),
};

function checkCuringRange(
  v: { initialCuringMinC?: number | null; initialCuringMaxC?: number | null },
  ctx: z.RefinementCtx,
) {
  const { initialCuringMinC: min, initialCuringMaxC: max } = v;
  if (typeof min === "number" && typeof max === "number" && max < min) {
    ctx.addIssue({
      code: "custom",
      path: ["initialCuringMaxC"],
      message: "The highest initial-curing temperature cannot be below the lowest",
    });
  }
}

export const specimenSetCreateSchema = z
  .object({ id: clientId, placementId: recordId("Placement"), ...specimenSetFields })
  .partial({ deliveryId: true, initialCuringMinC: true, initialCuringMaxC: true, sensorId: true })
  .superRefine(checkCuringRange);

export const specimenSetUpdateSchema = z.object(specimenSetFields).partial().superRefine(checkCuringRange);

// The strength is never taken from the client: the server computes it (lib/concrete, ASTM C39).
export const breakFields = {
  testedAt: instant("Test time"),
  ageDays: wholeNumber("Age", 0, 400, "days"),
  loadKN: measure("Maximum load", 0, 5_000, "kN").refine((v) => v > 0, "Maximum load must be greater than zero"),
  diameterMm: measure("Diameter", 50, 200, "mm"),
  lengthMm: measure("Length", 50, 450, "mm").nullable(),
  fractureType: wholeNumber("Fracture type", 1, 6).nullable(),
};

export const breakCreateSchema = z
  .object({ id: clientId, specimenSetId: recordId("Specimen set"), ...breakFields })
  .partial({ lengthMm: true, fractureType: true });

export const breakUpdateSchema = z.object(breakFields).partial();

export type SpecimenSetInput = z.input<typeof specimenSetCreateSchema>;
export type BreakInput = z.input<typeof breakCreateSchema>;

/** What the server fills in when a create leaves a field out (a new nullable field goes here with null). */
export const specimenSetDefaults = z.object({ deliveryId: specimenSetFields.deliveryId.default(null), sensorId: specimenSetFields.sensorId.default(null) });
export const breakDefaults = z.object({});
