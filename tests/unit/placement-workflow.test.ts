// Every state pair × every role: allowed exactly when the table below says so.
import { describe, expect, it } from "vitest";
import type { ProjectRole } from "@/lib/auth/roles";
import {
  allowedTransitions,
  canTransition,
  describeAllowed,
  PLACEMENT_STATES,
  type PlacementState,
} from "@/lib/placements/workflow";

// Written out by hand from the product brief, not derived from the code under test.
const ALLOWED: Record<ProjectRole, [PlacementState, PlacementState][]> = {
  superintendent: [
    ["planned", "ready"],
    ["ready", "planned"],
    ["held", "ready"],
    ["cleared", "placing"],
    ["placing", "placed"],
  ],
  inspector: [
    ["ready", "cleared"],
    ["ready", "held"],
    ["cleared", "held"],
    ["placed", "signed"],
  ],
  office: [],
  owner: [],
};

const ROLES = Object.keys(ALLOWED) as ProjectRole[];
const cases = ROLES.flatMap((role) =>
  PLACEMENT_STATES.flatMap((from) =>
    PLACEMENT_STATES.map((to) => ({
      role,
      from,
      to,
      allowed: ALLOWED[role].some(([f, t]) => f === from && t === to),
    })),
  ),
);

describe("placement workflow", () => {
  it("covers all 7 × 7 state pairs for each of the 4 roles", () => {
    expect(cases).toHaveLength(4 * 49);
    expect(cases.filter((c) => c.allowed)).toHaveLength(9);
  });

  it.each(cases)("$role: $from → $to is allowed: $allowed", ({ role, from, to, allowed }) => {
    expect(canTransition(from, to, role)).toBe(allowed);
    expect(allowedTransitions(from, role).includes(to)).toBe(allowed);
  });

  it.each(PLACEMENT_STATES.map((from) => ({ from })))("a non-member can move nothing from $from", ({ from }) => {
    expect(allowedTransitions(from, null)).toEqual([]);
    for (const to of PLACEMENT_STATES) expect(canTransition(from, to, null)).toBe(false);
  });

  it("a signed placement goes nowhere, whoever asks", () => {
    for (const role of ROLES) expect(allowedTransitions("signed", role)).toEqual([]);
  });

  it("no state moves to itself", () => {
    for (const role of ROLES) for (const state of PLACEMENT_STATES) expect(canTransition(state, state, role)).toBe(false);
  });

  it("says in plain words which moves are allowed now, and by whom, never a raw state code", () => {
    expect(describeAllowed("ready")).toBe(
      "This placement is ready for inspection. Next: the superintendent can take it back to planned; the inspector can clear it to place or hold it.",
    );
    expect(describeAllowed("placed")).toBe("This placement is placed. Next: the inspector can sign it off.");
    expect(describeAllowed("held")).toBe("This placement is held. Next: the superintendent can ask for inspection.");
    expect(describeAllowed("signed")).toMatch(/cannot change state any more; correct it with an amendment/);
    for (const state of PLACEMENT_STATES) expect(describeAllowed(state)).not.toMatch(/can go to:|\(inspector\)|\bcleared, held\b/);
  });
});
