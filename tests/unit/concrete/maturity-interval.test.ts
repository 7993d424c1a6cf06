import { describe, expect, it } from "vitest";

import { DEFAULT_MATURITY_SETTINGS, type MaturitySettings } from "../../../lib/concrete/maturity";
import { maturityBetween } from "../../../lib/concrete/maturity-interval";

const H = 3_600_000;
const cast = Date.UTC(2026, 10, 2, 14, 0, 0);
const at = (hours: number) => new Date(cast + hours * H);
// A field-cured cylinder's logger: every 30 min for 8 days, a daily swing of ±6 °C about 12 °C that warms 0.05 °C/h.
const record = Array.from({ length: 8 * 48 + 1 }, (_, i) => {
  const hours = i / 2;
  return { at: at(hours), tempC: 12 + 6 * Math.sin((2 * Math.PI * hours) / 24) + 0.05 * hours };
});

// ASTM C1074 Eq. 1 (Nurse-Saul) [memory]: M = Σ (Ta − T0)·Δt, Ta the mean temperature over Δt,
// intervals below the datum adding nothing. Written here as a plain loop, independently of lib/concrete.
function nurseSaulByHand(readings: { at: Date; tempC: number }[], datumC: number): number {
  let sum = 0;
  for (let i = 1; i < readings.length; i += 1) {
    const dtHours = (readings[i].at.getTime() - readings[i - 1].at.getTime()) / H;
    const meanC = (readings[i].tempC + readings[i - 1].tempC) / 2;
    sum += Math.max(0, meanC - datumC) * dtHours;
  }
  return sum;
}
const nurseSaul = (datumC: number): MaturitySettings => ({ ...DEFAULT_MATURITY_SETTINGS, method: "nurse-saul", datumC });

describe("maturityBetween: a set's logger record from the cast to a break (ASTM C1074)", () => {
  it("constant 20 °C for 48 h: 1440 °C·h at a datum of −10 °C, 960 °C·h at 0 °C [computed by hand: 30 × 48, 20 × 48]", () => {
    const flat = [0, 12, 24, 36, 48].map((h) => ({ at: at(h), tempC: 20 }));
    expect(maturityBetween(flat, at(0), at(48), nurseSaul(-10))).toEqual({ status: "ok", maturity: 1440 });
    expect(maturityBetween(flat, at(0), at(48), nurseSaul(0))).toEqual({ status: "ok", maturity: 960 });
  });

  it("7-day break on a varying record equals the hand loop, datum −10 °C (traditional Nurse-Saul datum [memory]) and 0 °C (C1074 default [memory])", () => {
    const upTo7Days = record.filter((r) => r.at.getTime() <= at(168).getTime());
    for (const datumC of [-10, 0]) {
      const got = maturityBetween(record, at(0), at(168), nurseSaul(datumC));
      expect(got.status).toBe("ok");
      if (got.status === "ok") expect(got.maturity).toBeCloseTo(nurseSaulByHand(upTo7Days, datumC), 9);
    }
    // Magnitude check [computed by hand]: the mean over 7 days is 12 + 0.05 × 84 = 16.2 °C → about 26.2 × 168 ≈ 4402 °C·h at −10 °C.
    const got = maturityBetween(record, at(0), at(168), nurseSaul(-10));
    if (got.status === "ok") expect(got.maturity).toBeGreaterThan(4350);
    if (got.status === "ok") expect(got.maturity).toBeLessThan(4450);
  });

  it("a cast and a break between two readings are cut by straight-line interpolation [hand loop over the cut record]", () => {
    const from = at(0.25);
    const to = at(167.75);
    const lerp = (t: Date) => {
      const i = record.findIndex((r) => r.at.getTime() > t.getTime());
      const a = record[i - 1];
      const b = record[i];
      return a.tempC + ((b.tempC - a.tempC) * (t.getTime() - a.at.getTime())) / (b.at.getTime() - a.at.getTime());
    };
    const cut = [{ at: from, tempC: lerp(from) }, ...record.filter((r) => r.at > from && r.at < to), { at: to, tempC: lerp(to) }];
    const got = maturityBetween(record, from, to, nurseSaul(-10));
    expect(got.status).toBe("ok");
    if (got.status === "ok") expect(got.maturity).toBeCloseTo(nurseSaulByHand(cut, -10), 9);
  });

  it("refuses a record that ends before the break, and one that starts after the cast, saying by how much", () => {
    const first5Days = record.filter((r) => r.at.getTime() <= at(120).getTime());
    expect(maturityBetween(first5Days, at(0), at(168), nurseSaul(-10))).toEqual({ status: "ends-before", endsAt: at(120), hoursBefore: 48 });
    const late = record.filter((r) => r.at.getTime() >= at(2).getTime());
    expect(maturityBetween(late, at(0), at(168), nurseSaul(-10))).toEqual({ status: "starts-after", startsAt: at(2), hoursAfter: 2 });
    expect(maturityBetween([], at(0), at(168))).toEqual({ status: "starts-after", startsAt: null, hoursAfter: null });
  });

  it("equivalent age at 20 °C of a record held at 20 °C equals its duration [ASTM C1074 Eq. 2: exp(0) = 1]", () => {
    const flat = [0, 24, 72].map((h) => ({ at: at(h), tempC: 20 }));
    const got = maturityBetween(flat, at(0), at(72), { ...DEFAULT_MATURITY_SETTINGS, method: "equivalent-age" });
    expect(got.status).toBe("ok");
    if (got.status === "ok") expect(got.maturity).toBeCloseTo(72, 9);
  });
});
