import { z } from "zod";
import { SLUMP_TYPES, STRENGTH_AGES_DAYS } from "@/lib/records/enums";
import { choice, clientId, measure, optionalText, requiredText, temperatureC } from "./fields";

export const mixDesignFields = {
  code: requiredText("Mix code", 32),
  supplier: optionalText("Supplier", 120),
  fcMPa: measure("Specified strength", 10, 150, "MPa"),
  fcAgeDays: z.literal(STRENGTH_AGES_DAYS, { error: "Strength age must be 28 or 56 days" }),
  maxWcm: measure("Maximum w/cm", 0.2, 0.8, "").nullable(),
  slumpTargetMm: measure("Slump", 0, 300, "mm").nullable(),
  slumpType: choice("Slump type", SLUMP_TYPES),
  slumpToleranceMm: measure("Slump tolerance", 0, 100, "mm").nullable(),
  airTargetPct: measure("Air content", 0, 12, "%").nullable(),
  airTolerancePct: measure("Air tolerance", 0, 5, "%").nullable(),
  maxConcreteTempC: temperatureC("Maximum concrete temperature").nullable(),
  cementType: optionalText("Cement type", 60),
  scms: optionalText("Supplementary materials", 500),
  siteWaterAllowedLPerM3: measure("Water that may be added at site", 0, 50, "L/m³"),
  lowBleed: z.boolean({ error: "Low bleed must be yes or no" }),
};

export const mixDesignCreateSchema = z
  .object({ id: clientId, ...mixDesignFields })
  .partial({
    supplier: true,
    maxWcm: true,
    slumpTargetMm: true,
    slumpType: true,
    slumpToleranceMm: true,
    airTargetPct: true,
    airTolerancePct: true,
    maxConcreteTempC: true,
    cementType: true,
    scms: true,
    siteWaterAllowedLPerM3: true,
    lowBleed: true,
  });
export const mixDesignUpdateSchema = z.object(mixDesignFields).partial();

export type MixDesignInput = z.input<typeof mixDesignCreateSchema>;
export type MixDesignValues = z.output<typeof mixDesignCreateSchema>;

/** What the server fills in when a create leaves a field out (the column defaults of db/schema): the device
 * starts an optimistic row from these, so it looks like the row the server will send. */
export const mixDesignDefaults = z.object({
  supplier: mixDesignFields.supplier.default(""),
  fcAgeDays: mixDesignFields.fcAgeDays.default(28),
  slumpType: mixDesignFields.slumpType.default("target"),
  cementType: mixDesignFields.cementType.default(""),
  scms: mixDesignFields.scms.default(""),
  siteWaterAllowedLPerM3: mixDesignFields.siteWaterAllowedLPerM3.default(0),
  lowBleed: mixDesignFields.lowBleed.default(false),
});
