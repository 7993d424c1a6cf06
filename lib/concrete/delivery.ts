// Ready-mixed concrete delivery limits (ASTM C94): discharge time, drum revolutions, site water.
import { ConcreteInputError, assertDate, assertNonNegative, assertPositive } from "./errors";

const MS_PER_MINUTE = 60_000;

function minutesBetween(start: Date, end: Date): number {
  return (end.getTime() - start.getTime()) / MS_PER_MINUTE;
}

export interface DischargeCheck {
  minutes: number;
  limitMinutes: number;
  withinTime: boolean;
  /** null when the order states no revolution limit or the count was not recorded. */
  withinRevolutions: boolean | null;
}

// ASTM C94 §10.7: discharge complete within 90 min of batching; revolution limit only if ordered (C94-17a §6.1.9).
export function checkDischarge({
  batchedAt,
  dischargeFinishedAt,
  limitMinutes = 90,
  revolutions,
  revolutionLimit,
}: {
  batchedAt: Date;
  dischargeFinishedAt: Date;
  /** The purchaser may waive or, in hot weather, shorten the 90 min. */
  limitMinutes?: number;
  revolutions?: number;
  revolutionLimit?: number;
}): DischargeCheck {
  assertDate(batchedAt, "batchedAt", "Batch time");
  assertDate(dischargeFinishedAt, "dischargeFinishedAt", "Discharge finish time");
  assertPositive(limitMinutes, "limitMinutes", "Discharge time limit");
  const minutes = minutesBetween(batchedAt, dischargeFinishedAt);
  if (minutes < 0) {
    throw new ConcreteInputError("dischargeFinishedAt", "Discharge cannot finish before the concrete was batched");
  }
  let withinRevolutions: boolean | null = null;
  if (revolutionLimit !== undefined) {
    assertPositive(revolutionLimit, "revolutionLimit", "Revolution limit");
    if (revolutions !== undefined) {
      assertNonNegative(revolutions, "revolutions", "Drum revolutions");
      withinRevolutions = revolutions <= revolutionLimit;
    }
  }
  return { minutes, limitMinutes, withinTime: minutes <= limitMinutes, withinRevolutions };
}

export interface WaterAdditionCheck {
  minutesSpan: number;
  withinWindow: boolean;
  withinAllowance: boolean;
  remainingLitres: number;
  note: string;
}

const WATER_WINDOW_MINUTES = 15;
const WATER_NOTE =
  "One addition only, all portions within 15 min of the first, then at least 30 drum revolutions " +
  "at mixing speed; never beyond the mix design's maximum water.";

// ASTM C94 (current wording): one site water addition within 15 min of its first portion, within the allowance.
export function checkWaterAddition({
  firstAt,
  lastAt,
  addedLitres,
  allowedLitres,
}: {
  firstAt: Date;
  lastAt: Date;
  addedLitres: number;
  /** Water withheld at batching that may still be added without exceeding the mix's maximum. */
  allowedLitres: number;
}): WaterAdditionCheck {
  assertDate(firstAt, "firstAt", "Time of the first water portion");
  assertDate(lastAt, "lastAt", "Time of the last water portion");
  assertNonNegative(addedLitres, "addedLitres", "Water added");
  assertNonNegative(allowedLitres, "allowedLitres", "Water allowed");
  const minutesSpan = minutesBetween(firstAt, lastAt);
  if (minutesSpan < 0) {
    throw new ConcreteInputError("lastAt", "The last water portion cannot come before the first");
  }
  return {
    minutesSpan,
    withinWindow: minutesSpan <= WATER_WINDOW_MINUTES,
    withinAllowance: addedLitres <= allowedLitres,
    remainingLitres: Math.max(0, allowedLitres - addedLitres),
    note: WATER_NOTE,
  };
}
