// The inspection log's two lifecycles as pure functions, shared by the server (lib/site-visits/
// transition.ts) and the device (lib/sync/client), so an answer given offline follows the same rules.
//   visit report: draft → submitted (→ draft to correct it) → signed (only through the sign-off)
//   finding:      open → answered → closed, closed or answered → open (reopened); open → closed when
//                 the inspector sees the work fixed on re-inspection without a written answer.
// Who may make a move is the permission it needs in lib/auth/can (the one door).
import { z } from "zod";
import { can, type Action } from "@/lib/auth/can";
import { PROJECT_ROLES, type ProjectRole } from "@/lib/auth/roles";
import { FINDING_STATES, SITE_VISIT_STATES, type FindingState, type SiteVisitState } from "@/lib/records/enums";
import { describeNextSteps, FINDING_MOVE_WORDS, SITE_VISIT_MOVE_WORDS, statePhrase, type MoveWords } from "@/lib/ui/vocabulary";

export type LifecycleType = "site-visits" | "findings";
type StateOf<T extends LifecycleType> = T extends "site-visits" ? SiteVisitState : FindingState;

/** What the move needs besides the permission: the answer's text, or the reason for reopening. */
type Needs = "response" | "reason" | null;
export type LifecycleMove<T extends LifecycleType = LifecycleType> = { from: StateOf<T>; to: StateOf<T>; action: Action; needs: Needs; verb: string };

export const VISIT_MOVES: readonly LifecycleMove<"site-visits">[] = [
  { from: "draft", to: "submitted", action: "visit.write", needs: null, verb: "submit" },
  { from: "submitted", to: "draft", action: "visit.write", needs: null, verb: "take back to draft" },
];

export const FINDING_MOVES: readonly LifecycleMove<"findings">[] = [
  { from: "open", to: "answered", action: "finding.answer", needs: "response", verb: "answer" },
  { from: "answered", to: "closed", action: "finding.close", needs: null, verb: "close" },
  { from: "open", to: "closed", action: "finding.close", needs: null, verb: "close" },
  { from: "answered", to: "open", action: "finding.close", needs: "reason", verb: "reopen" },
  { from: "closed", to: "open", action: "finding.close", needs: "reason", verb: "reopen" },
];


const text = (label: string, max: number) =>
  z.string({ error: `${label} must be text` }).trim().max(max, `${label} can be at most ${max} characters`).optional();

/** The arguments of a lifecycle move (mutation "transition" of a site visit or a finding). */
export const lifecycleArgsSchema = z.object({
  to: z.enum([...new Set([...SITE_VISIT_STATES, ...FINDING_STATES])] as [string, ...string[]], {
    error: `The new state must be one of: ${[...SITE_VISIT_STATES, ...FINDING_STATES].join(", ")}`,
  }),
  response: text("The answer", 4_000),
  note: text("The note", 2_000),
  reason: text("The reason", 2_000),
});
export type LifecycleArgs = z.infer<typeof lifecycleArgsSchema>;

function movesOf(type: LifecycleType): readonly LifecycleMove[] {
  return type === "site-visits" ? VISIT_MOVES : FINDING_MOVES;
}

export function findMove(type: LifecycleType, from: string, to: string): LifecycleMove | undefined {
  return movesOf(type).find((m) => m.from === from && m.to === to);
}

export function rolesForMove(move: LifecycleMove): ProjectRole[] {
  return PROJECT_ROLES.filter((role) => can({ isAdmin: false }, move.action, role));
}

/** The moves `role` may make from `state` (none for a non-member), e.g. for the buttons of a screen. */
export function allowedMoves(type: LifecycleType, state: string, role: ProjectRole | null): LifecycleMove[] {
  if (role === null) return [];
  return movesOf(type).filter((m) => m.from === state && can({ isAdmin: false }, m.action, role));
}

const NOUN: Record<LifecycleType, string> = { "site-visits": "visit report", findings: "finding" };
const phraseOfState = (type: LifecycleType, state: string) => statePhrase(type === "site-visits" ? "site-visit" : "finding", state);
const phraseOf = (type: LifecycleType, to: string) => ((type === "site-visits" ? SITE_VISIT_MOVE_WORDS : FINDING_MOVE_WORDS) as Record<string, MoveWords>)[to]?.phrase ?? to;

/**
 * What can happen next, in words: "This finding is waiting for its correction to be checked. Next: the inspector can close
 * it or reopen it." Said plainly when there is no way on.
 */
export function describeMoves(type: LifecycleType, state: string, viewer?: ProjectRole | null): string {
  if (type === "site-visits" && state === "signed") return "This visit report is signed; add an amendment instead.";
  const groups = new Map<string, { roles: string[]; phrases: string[] }>();
  for (const m of movesOf(type).filter((m) => m.from === state)) {
    const roles = rolesForMove(m);
    const group = groups.get(roles.join()) ?? { roles, phrases: [] };
    group.phrases.push(phraseOf(type, m.to));
    groups.set(roles.join(), group);
  }
  const whenNone = type === "site-visits" ? "It is signed through the sign-off." : "It cannot change state.";
  const text = describeNextSteps(NOUN[type], phraseOfState(type, state), [...groups.values()], whenNone, viewer);
  return type === "site-visits" && state === "submitted" ? `${text.slice(0, -1)}; it is signed through the sign-off.` : text;
}

export type MoveCheck = { ok: true; move: LifecycleMove } | { ok: false; code: "state" | "forbidden" | "invalid_input"; message: string; field?: string };

/**
 * Is the move from `from` to `args.to` allowed for `role`, with what it needs? Order of the answers:
 * a move that does not exist (409 on the server), one that belongs to another role (403), then
 * the missing answer or reason (400).
 */
export function checkMove(type: LifecycleType, from: string, args: LifecycleArgs, role: ProjectRole | null): MoveCheck {
  if (type === "site-visits" && args.to === "signed") {
    return { ok: false, code: "state", message: "A visit report is signed through the sign-off (typed name, signature and password), not by a state change." };
  }
  const move = findMove(type, from, args.to);
  if (!move) return { ok: false, code: "state", message: describeMoves(type, from) };
  if (role === null || !can({ isAdmin: false }, move.action, role)) {
    return { ok: false, code: "forbidden", message: `Only the ${rolesForMove(move).join(" or the ")} can ${move.verb} a ${NOUN[type]} that is ${phraseOfState(type, from)}.` };
  }
  if (move.needs === "response" && !args.response) {
    return { ok: false, code: "invalid_input", field: "response", message: "Say what was done to fix it" };
  }
  if (move.needs === "reason" && !args.reason) {
    return { ok: false, code: "invalid_input", field: "reason", message: "Say why the finding is reopened" };
  }
  return { ok: true, move };
}

/**
 * The fields a move sets (the same on the device and the server). Answer: the response, by whom and
 * when. Close: by whom, when and the note. Reopen: by whom, when and why; the close is cleared and
 * the earlier answer stays visible until the next one (the audit trail keeps every one).
 */
export function moveEffect(type: LifecycleType, move: LifecycleMove, args: LifecycleArgs, userId: string | null, at: Date): Record<string, unknown> {
  if (type === "site-visits") return { state: move.to, submittedAt: move.to === "submitted" ? at : null };
  switch (move.to) {
    case "answered":
      return { state: "answered", response: args.response ?? "", answeredAt: at, answeredBy: userId };
    case "closed":
      return { state: "closed", closedAt: at, closedBy: userId, closeNote: args.note || null };
    default:
      return { state: "open", reopenedAt: at, reopenedBy: userId, reopenReason: args.reason ?? null, closedAt: null, closedBy: null, closeNote: null };
  }
}

/** Findings that still need work (shown on Today, on the placement they hold up and in the report). */
export const isOutstanding = (state: unknown) => state === "open" || state === "answered";
