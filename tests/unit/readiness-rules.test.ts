// The readiness rules of the field screen (lib/placements/readiness.ts). Expected verdicts are
// written out by hand from the rules of the product brief (issue 7: each item yes / no / not
// applicable with a note) and the pre-placement checks of concrete inspection practice
// [common practice]; not derived from the code under test.
import { describe, expect, it } from "vitest";
import { READINESS_ITEMS, readinessOrder, readinessVerdict, type ReadinessItem } from "@/lib/placements/readiness";

const item = (itemKey: string, answer: ReadinessItem["answer"], note: string | null = null): ReadinessItem => ({ itemKey, label: itemKey, answer, note });

describe("readiness rules", () => {
  it("no checklist, or an empty one, is not ready and says to fill it in", () => {
    for (const items of [null, undefined, []]) {
      expect(readinessVerdict(items)).toEqual({ ready: false, answered: 0, total: 0, noCount: 0, problems: ["Fill in the readiness checklist first."] });
    }
  });

  it("every item answered yes is ready", () => {
    const v = readinessVerdict([item("forms", "yes"), item("cover", "yes"), item("pump", "yes")]);
    expect(v).toEqual({ ready: true, answered: 3, total: 3, noCount: 0, problems: [] });
  });

  it("unanswered items block and are named", () => {
    const v = readinessVerdict([item("forms", "yes"), item("cover", null), item("pump", undefined)]);
    expect(v.ready).toBe(false);
    expect(v.answered).toBe(1);
    expect(v.problems).toEqual(["2 items are not answered: cover; pump."]);
    expect(readinessVerdict([item("forms", null)]).problems).toEqual(["1 item is not answered: forms."]);
  });

  it("a no needs a note; with a note it no longer blocks (the inspector judges it)", () => {
    const bare = readinessVerdict([item("cover", "no"), item("forms", "yes")]);
    expect(bare.ready).toBe(false);
    expect(bare.problems).toEqual(['Say what is wrong and what is being done for "cover".']);
    const blank = readinessVerdict([item("cover", "no", "   ")]);
    expect(blank.ready).toBe(false);
    const noted = readinessVerdict([item("cover", "no", "1 in at SW-3; bars being re-chaired, done by 07:00"), item("forms", "yes")]);
    expect(noted).toEqual({ ready: true, answered: 2, total: 2, noCount: 1, problems: [] });
  });

  it("not applicable also needs a reason", () => {
    expect(readinessVerdict([item("pump", "na")]).problems).toEqual(['Say why "pump" does not apply.']);
    expect(readinessVerdict([item("pump", "na", "Placed by crane and bucket")]).ready).toBe(true);
  });

  it("the default list covers the brief's items, with unique keys", () => {
    const keys = READINESS_ITEMS.map((i) => i.itemKey);
    expect(new Set(keys).size).toBe(keys.length);
    // Issue 7: forms, reinforcement and cover, embeds and sleeves, cleanliness, access and pump set-up,
    // standby vibrators, weather plan, testing crew present.
    for (const k of ["forms", "reinforcement", "cover", "embeds", "cleanliness", "access", "pump", "vibrators", "weather-plan", "testing-crew"]) {
      expect(keys).toContain(k);
    }
  });

  it("sorts default items in list order and others after them by label", () => {
    const rows = [
      { itemKey: "zz", label: "Extra B" },
      { itemKey: "pump", label: "Pump" },
      { itemKey: "forms", label: "Forms" },
      { itemKey: "aa", label: "Extra A" },
    ];
    expect([...rows].sort(readinessOrder).map((r) => r.label)).toEqual(["Forms", "Pump", "Extra A", "Extra B"]);
  });
});
