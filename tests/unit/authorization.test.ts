import { describe, expect, it } from "vitest";
import { ACTIONS, ADMIN_ACTIONS, can, type Action } from "@/lib/auth/can";
import { PROJECT_ROLES, type ProjectRole } from "@/lib/auth/roles";

// The expected permission table, written out by hand from the product brief's roles (not derived
// from the implementation): S superintendent, I inspector, O office, W owner.
const TABLE: Record<Action, string> = {
  "project.read": "SIOW",
  "project.manage": "",
  "mix.write": "O",
  "placement.write": "S",
  "placement.markReady": "S",
  "placement.review": "I",
  "placement.start": "S",
  "placement.sign": "I",
  "delivery.write": "S",
  "fieldTest.write": "I",
  "specimen.write": "I",
  "break.write": "O",
  "weather.write": "SI",
  "checklist.write": "SI",
  "curing.write": "S",
  "diary.write": "S",
  "diary.submit": "S",
  "photo.add": "SIO",
  "visit.write": "I",
  "finding.answer": "S",
  "finding.close": "I",
  "visit.sign": "I",
  "amendment.write": "IO",
  "record.correct": "O",
  "digest.manage": "O",
  "digest.read": "OW",
  "digest.subscribe": "W",
  "report.export": "SIOW",
};

const LETTER: Record<ProjectRole, string> = { superintendent: "S", inspector: "I", office: "O", owner: "W" };

describe("can(): every action for every role (default deny)", () => {
  it("the table covers every action", () => {
    expect(Object.keys(TABLE).sort()).toEqual([...ACTIONS].sort());
  });

  for (const action of ACTIONS) {
    for (const role of PROJECT_ROLES) {
      const expected = TABLE[action].includes(LETTER[role]);
      it(`${role} ${expected ? "may" : "may not"} ${action}`, () => {
        expect(can({ isAdmin: false }, action, role)).toBe(expected);
      });
    }
    it(`a non-member may not ${action}`, () => {
      expect(can({ isAdmin: false }, action, null)).toBe(false);
    });
  }

  it("the owner changes nothing of the project: read, export and their own digest row", () => {
    const allowed = ACTIONS.filter((a) => can({ isAdmin: false }, a, "owner"));
    expect(allowed).toEqual(["project.read", "digest.read", "digest.subscribe", "report.export"]);
  });

  it("the admin flag manages users and projects, but reads no project's records without a membership", () => {
    for (const a of ADMIN_ACTIONS) {
      expect(can({ isAdmin: true }, a, null)).toBe(true);
      expect(can({ isAdmin: false }, a, "office")).toBe(false);
    }
    expect(can({ isAdmin: true }, "project.manage", null)).toBe(true);
    expect(can({ isAdmin: true }, "project.read", null)).toBe(false);
    expect(can({ isAdmin: true }, "placement.write", null)).toBe(false);
    // Nor the digest: its history and recipients name people and addresses of the project.
    expect(can({ isAdmin: true }, "digest.manage", null)).toBe(false);
    expect(can({ isAdmin: true }, "digest.read", null)).toBe(false);
    // With a membership an admin has exactly that role's powers.
    expect(can({ isAdmin: true }, "placement.sign", "inspector")).toBe(true);
    expect(can({ isAdmin: true }, "placement.sign", "superintendent")).toBe(false);
  });

  it("an unknown action is refused", () => {
    expect(can({ isAdmin: true }, "placement.delete-everything" as Action, "office")).toBe(false);
  });
});
