import { z } from "zod";
import { SUN_EXPOSURES } from "@/lib/records/enums";
import { choice, clientId, pastInstant, measure, recordId, temperatureC } from "./fields";

// The evaporation rate is never taken from the client: the server computes it (lib/concrete).
export const weatherFields = {
  observedAt: pastInstant("Observation time"),
  airTempC: temperatureC("Air temperature"),
  relativeHumidityPct: measure("Relative humidity", 0, 100, "%"),
  windKmh: measure("Wind speed", 0, 200, "km/h"),
  concreteTempC: temperatureC("Concrete temperature").nullable(),
  sun: choice("Sun", SUN_EXPOSURES).nullable(),
};

const weatherPlacementId = recordId("Placement").nullable();

export const weatherCreateSchema = z
  .object({ id: clientId, placementId: weatherPlacementId, ...weatherFields })
  .partial({ placementId: true, concreteTempC: true, sun: true });

export const weatherUpdateSchema = z.object(weatherFields).partial();

export type WeatherInput = z.input<typeof weatherCreateSchema>;

/** What the server fills in when a create leaves a field out: an observation of the day, on no placement. */
export const weatherDefaults = z.object({ placementId: weatherPlacementId.default(null) });
