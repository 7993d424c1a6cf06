import { describe, expect, it } from "vitest";
import { placementName, preselectedProject, projectToday, reportPatch, reportValues, timeOnSite, visitProjects } from "@/components/site-visits/visit-model";

// Issue 17: the visit report reads and writes times on the project's clock, whatever the device's
// zone. Offsets from the IANA time zone database: America/Chicago is UTC−5 (CDT) in summer and UTC−6
// (CST) in winter; clocks go back from 02:00 CDT to 01:00 CST on the first Sunday of November
// (2026-11-01) [US Energy Policy Act of 2005, 15 U.S.C. §260a].
const CHICAGO = "America/Chicago";

describe("visit report times on the project's clock", () => {
  it("shows a stored instant as the wall time in the project's zone, not UTC or the device's", () => {
    expect(timeOnSite("2026-07-01T13:30:00.000Z", CHICAGO)).toBe("08:30"); // CDT, UTC−5
    expect(timeOnSite("2026-12-01T13:30:00.000Z", CHICAGO)).toBe("07:30"); // CST, UTC−6
    expect(timeOnSite("2026-07-01T13:30:00.000Z", "Asia/Tokyo")).toBe("22:30"); // JST, UTC+9, no DST
    expect(timeOnSite(null, CHICAGO)).toBe("");
    expect(timeOnSite("not a time", CHICAGO)).toBe("");
  });

  it("writes typed times as instants on the visit's date in the project's zone", () => {
    const values = { ...reportValues({ visitDate: "2026-07-01" }, CHICAGO), arrived: "08:30", left: "11:05" };
    const patch = reportPatch(values, CHICAGO);
    expect(patch.arrivedAt).toBe("2026-07-01T13:30:00.000Z");
    expect(patch.leftAt).toBe("2026-07-01T16:05:00.000Z");
    expect(patch.visitDate).toBe("2026-07-01");
    // Round trip: what is written reads back as typed.
    expect(reportValues({ ...values, ...patch }, CHICAGO)).toMatchObject({ arrived: "08:30", left: "11:05" });
  });

  it("a 'to' earlier than 'from' is the next morning (a night pour's visit)", () => {
    const patch = reportPatch({ ...reportValues({ visitDate: "2026-07-01" }, CHICAGO), arrived: "22:40", left: "01:15" }, CHICAGO);
    expect(patch.arrivedAt).toBe("2026-07-02T03:40:00.000Z");
    expect(patch.leftAt).toBe("2026-07-02T06:15:00.000Z");
  });

  it("on the night clocks go back, 01:30 is the first one (CDT)", () => {
    const patch = reportPatch({ ...reportValues({ visitDate: "2026-11-01" }, CHICAGO), arrived: "01:30", left: "" }, CHICAGO);
    expect(patch.arrivedAt).toBe("2026-11-01T06:30:00.000Z");
    expect(patch.leftAt).toBeNull();
  });

  it("a new visit is dated today where the project is", () => {
    // 03:00 UTC on Dec 3 is 21:00 CST on Dec 2 in Chicago, and 12:00 on Dec 3 in Tokyo.
    const now = new Date("2026-12-03T03:00:00Z");
    expect(projectToday(CHICAGO, now)).toBe("2026-12-02");
    expect(projectToday("Asia/Tokyo", now)).toBe("2026-12-03");
  });
});

describe("which project a new visit is on", () => {
  // PRODUCT.md: the inspector writes the visit reports; the other roles read them.
  const projects = [
    { id: "a", name: "Larkspur Commons", role: "inspector" },
    { id: "b", name: "Millrace Pump House", role: "superintendent" },
    { id: "c", name: "Fenwick Hollow", role: "owner" },
    { id: "d", name: "Office only", role: "office" },
  ];

  it("offers only the projects where the person may write visit reports", () => {
    expect(visitProjects(projects).map((p) => p.id)).toEqual(["a"]);
    expect(visitProjects([{ id: "x", role: null }])).toEqual([]);
  });

  it("preselects the project shown when the person may write there, else the only one, else none", () => {
    const two = [{ id: "a" }, { id: "e" }];
    expect(preselectedProject(two, "e")).toBe("e");
    expect(preselectedProject(two, null)).toBe("");
    expect(preselectedProject(two, "b")).toBe("");
    expect(preselectedProject([{ id: "a" }], null)).toBe("a");
    expect(preselectedProject([{ id: "a" }], "b")).toBe("a");
  });
});

describe("a finding names its placement", () => {
  it("by element and kind in words, never the stored code", () => {
    expect(placementName({ element: "Level 2 deck, pour 3", elementType: "elevated-slab" })).toBe("Level 2 deck, pour 3 (Elevated slab)");
    expect(placementName({ element: "Pump pit walls" })).toBe("Pump pit walls");
    expect(placementName(undefined)).toMatch(/not on this device/);
  });
});
