// The placement workflow as a pure state machine (PRODUCT.md: planned → ready → cleared → placing →
// placed → signed, or held with a reason). Who may make a transition is decided by the permission
// it needs in lib/auth/can, so the one authorization module stays the one door.
import { can, type Action } from "@/lib/auth/can";
import { PROJECT_ROLES, type ProjectRole } from "@/lib/auth/roles";
import { PLACEMENT_STATES, type PlacementState } from "@/lib/records/enums";

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

export const STATE_LABELS: Record<PlacementState, string> = {
  planned: "Planned",
  ready: "Ready for review",
  cleared: "Cleared to place",
  placing: "Placing",
  placed: "Placed",
  signed: "Signed",
  held: "Held",
};

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
 * "A placement that is ready can go to: cleared, held (inspector); planned (superintendent)."
 * Grouped by the role that may make them; said plainly when there is no way on.
 */
export function describeAllowed(state: PlacementState): string {
  const groups = new Map<string, PlacementState[]>();
  for (const t of TRANSITIONS.filter((t) => t.from === state)) {
    const who = rolesFor(t).join(", ");
    groups.set(who, [...(groups.get(who) ?? []), t.to]);
  }
  if (groups.size === 0) return `A placement that is ${state} cannot change state; correct it with an amendment.`;
  const parts = [...groups].map(([who, states]) => `${states.join(", ")} (${who})`);
  return `A placement that is ${state} can go to: ${parts.join("; ")}.`;
}
