// The inspection log's lifecycles: every state pair × every role, allowed exactly when the table
// below says so. Source: issue 7 item 7 (the superintendent answers a finding with what was done;
// the inspector closes it after re-inspection or reopens it; office and owner read) [product brief].
import { describe, expect, it } from "vitest";
import type { ProjectRole } from "@/lib/auth/roles";
import { FINDING_STATES, SITE_VISIT_STATES } from "@/lib/records/enums";
import { allowedMoves, checkMove, isOutstanding, moveEffect, type LifecycleType } from "@/lib/site-visits/lifecycle";

// Written out by hand from the issue, not derived from the code under test.
const FINDING_ALLOWED: Record<ProjectRole, [string, string][]> = {
  superintendent: [["open", "answered"]],
  inspector: [
    ["answered", "closed"],
    ["open", "closed"],
    ["answered", "open"],
    ["closed", "open"],
  ],
  office: [],
  owner: [],
};
const VISIT_ALLOWED: Record<ProjectRole, [string, string][]> = {
  superintendent: [],
  inspector: [
    ["draft", "submitted"],
    ["submitted", "draft"],
  ],
  office: [],
  owner: [],
};

const ROLES = Object.keys(FINDING_ALLOWED) as ProjectRole[];
const complete = { response: "Chairs raised to 40 mm; photo attached", reason: "Cover still 30 mm at C/4", note: "Seen on re-inspection" };

function cases(type: LifecycleType, states: readonly string[], table: Record<ProjectRole, [string, string][]>) {
  return ROLES.flatMap((role) =>
    states.flatMap((from) => states.filter((to) => to !== from).map((to) => ({ role, from, to, allowed: table[role].some(([f, t]) => f === from && t === to) }))),
  ).map((c) => ({ ...c, type }));
}

describe("finding lifecycle: open → answered → closed, reopen → open", () => {
  it.each(cases("findings", FINDING_STATES, FINDING_ALLOWED))("$role: $from → $to allowed=$allowed", ({ type, role, from, to, allowed }) => {
    const result = checkMove(type, from, { to, ...complete }, role);
    expect(result.ok).toBe(allowed);
    expect(allowedMoves(type, from, role).some((m) => m.to === to)).toBe(allowed);
  });

  it("a move that exists but belongs to another role is 'forbidden' and names the role", () => {
    const r = checkMove("findings", "open", { to: "answered", response: "Done" }, "inspector");
    expect(r).toMatchObject({ ok: false, code: "forbidden" });
    expect(!r.ok && r.message).toContain("superintendent");
  });

  it("a move that does not exist is 'state' and says where the finding can go", () => {
    const r = checkMove("findings", "closed", { to: "answered", response: "Done" }, "superintendent");
    expect(r).toMatchObject({ ok: false, code: "state" });
    expect(!r.ok && r.message).toBe("This finding is closed. Next: the inspector can reopen it.");
  });

  it("answering needs the answer, reopening needs the reason", () => {
    expect(checkMove("findings", "open", { to: "answered" }, "superintendent")).toMatchObject({ ok: false, code: "invalid_input", field: "response" });
    expect(checkMove("findings", "closed", { to: "open" }, "inspector")).toMatchObject({ ok: false, code: "invalid_input", field: "reason" });
    expect(checkMove("findings", "answered", { to: "closed" }, "inspector").ok).toBe(true);
  });

  it("a non-member can make no move", () => {
    expect(allowedMoves("findings", "open", null)).toEqual([]);
    expect(checkMove("findings", "open", { to: "answered", response: "x" }, null)).toMatchObject({ ok: false, code: "forbidden" });
  });

  it("the effects: answer stamps who and when; reopen clears the close and keeps the earlier answer", () => {
    const at = new Date("2026-11-17T15:00:00Z");
    const answer = checkMove("findings", "open", { to: "answered", response: "Chairs raised" }, "superintendent");
    if (!answer.ok) throw new Error("expected ok");
    expect(moveEffect("findings", answer.move, { to: "answered", response: "Chairs raised" }, "u-sup", at)).toEqual({
      state: "answered",
      response: "Chairs raised",
      answeredAt: at,
      answeredBy: "u-sup",
    });
    const reopen = checkMove("findings", "closed", { to: "open", reason: "Still short" }, "inspector");
    if (!reopen.ok) throw new Error("expected ok");
    const effect = moveEffect("findings", reopen.move, { to: "open", reason: "Still short" }, "u-insp", at);
    expect(effect).toMatchObject({ state: "open", reopenedBy: "u-insp", reopenReason: "Still short", closedAt: null, closedBy: null });
    expect(effect).not.toHaveProperty("response");
  });

  it("open and answered findings are outstanding; closed ones are not", () => {
    expect(FINDING_STATES.filter(isOutstanding)).toEqual(["open", "answered"]);
  });
});

describe("visit report lifecycle: draft ⇄ submitted; signed only through the sign-off", () => {
  it.each(cases("site-visits", SITE_VISIT_STATES, VISIT_ALLOWED))("$role: $from → $to allowed=$allowed", ({ type, role, from, to, allowed }) => {
    expect(checkMove(type, from, { to }, role).ok).toBe(allowed);
  });

  it("no state change reaches 'signed', whoever asks", () => {
    for (const role of ROLES) {
      const r = checkMove("site-visits", "submitted", { to: "signed" }, role);
      expect(r).toMatchObject({ ok: false, code: "state" });
      expect(!r.ok && r.message).toContain("sign-off");
    }
  });
});
