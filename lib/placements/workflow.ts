// The placement workflow as a pure state machine (PRODUCT.md: planned → ready → cleared → placing →
// placed → signed, or held with a reason). Who may make a transition is decided by the permission
// it needs in lib/auth/can, so the one authorization module stays the one door.
import { can, type Action } from "@/lib/auth/can";
import { PROJECT_ROLES, type ProjectRole } from "@/lib/auth/roles";
import { PLACEMENT_STATES, type PlacementState } from "@/lib/records/enums";
import { describeNextSteps, PLACEMENT_MOVE_WORDS, placementStateLabel, statePhrase } from "@/lib/ui/vocabulary";

export { PLACEMENT_STATES, type PlacementState };

export type Transition = { from: PlacementState; to: PlacementState; action: Action };

export const TRANSITIONS: readonly Transition[] = [
  // superintendent: gets the pour ready, runs it, withdraws it, fixes a hold
  { from: "planned", to: "ready", action: "placement.markReady" },
  { from: "ready", to: "planned", action: "placement.markReady" },
  { from: "held", to: "ready", action: "placement.markReady" },
  { from: "cleared", to: "placing", action: "placement.start" },
  { from: "placing", to: "placed", action: "placement.start" },
  // inspector: clears or holds after the readiness review, signs the placed work
  { from: "ready", to: "cleared", action: "placement.review" },
  { from: "ready", to: "held", action: "placement.review" },
  { from: "cleared", to: "held", action: "placement.review" },
  { from: "placed", to: "signed", action: "placement.sign" },
];

/** Roles allowed to make a transition (derived from the permissions, for messages and screens). */
export function rolesFor(transition: Transition): ProjectRole[] {
  return PROJECT_ROLES.filter((role) => can({ isAdmin: false }, transition.action, role));
}

export function findTransition(from: PlacementState, to: PlacementState): Transition | undefined {
  return TRANSITIONS.find((t) => t.from === from && t.to === to);
}

/** The states a placement in `state` may move to when `role` acts (none for a non-member). */
export function allowedTransitions(state: PlacementState, role: ProjectRole | null): PlacementState[] {
  if (role === null) return [];
  return TRANSITIONS.filter((t) => t.from === state && can({ isAdmin: false }, t.action, role)).map((t) => t.to);
}

export function canTransition(from: PlacementState, to: PlacementState, role: ProjectRole | null): boolean {
  return allowedTransitions(from, role).includes(to);
}

/**
 * What can happen next to a placement in `state`, in words: "This placement is ready for inspection.
 * Next: the superintendent can take it back to planned; the inspector can clear it to place or hold it."
 * Grouped by the roles that may make the moves; said plainly when there is no way on. With `viewer`,
 * said to that person: "You can ask for inspection."
 */
export function describeAllowed(state: PlacementState, viewer?: ProjectRole | null): string {
  const groups = new Map<string, { roles: string[]; phrases: string[] }>();
  for (const t of TRANSITIONS.filter((t) => t.from === state)) {
    const roles = rolesFor(t);
    const group = groups.get(roles.join()) ?? { roles, phrases: [] };
    group.phrases.push(PLACEMENT_MOVE_WORDS[t.to].phrase);
    groups.set(roles.join(), group);
  }
  return describeNextSteps("placement", statePhrase("placement", state), [...groups.values()], "It cannot change state any more; correct it with an amendment.", viewer);
}

/** The refusal when another role's move is tried: "Only the inspector can move a placement from “Ready for inspection” to “Held”." */
export function describeForbidden(transition: Transition): string {
  return `Only the ${rolesFor(transition).join(" or the ")} can move a placement from “${placementStateLabel(transition.from)}” to “${placementStateLabel(transition.to)}”.`;
}

/** States in which concrete is expected: cleared by the inspector, or being placed. */
export const TAKES_CONCRETE: readonly PlacementState[] = ["cleared", "placing"];

/** Whether a truck on a placement in `state` needs a reason (it is not cleared or being placed). */
export const truckNeedsReason = (state: unknown): boolean => !TAKES_CONCRETE.includes(state as PlacementState);
