import type { ProjectRole } from "./roles";

// The one place that decides permissions. Default deny: an action not listed for a role is refused.
// Pure and synchronous so it can be used on the server, in the field UI (to hide controls) and in
// table-driven unit tests. The server always re-checks; hiding a button is a courtesy, not security.

export const ACTIONS = [
  // project level
  "project.read",
  "project.manage", // name, settings, members, digest recipients
  // records (written by the field or the office)
  "mix.write",
  "placement.write",
  "placement.markReady",
  "placement.review", // clear or hold
  "placement.start", // placing / placed
  "placement.sign",
  "delivery.write",
  "fieldTest.write",
  "specimen.write",
  "break.write",
  "weather.write",
  "checklist.write",
  "curing.write",
  "diary.write",
  "diary.submit",
  "photo.add",
  "visit.write",
  "finding.answer",
  "finding.close",
  "visit.sign",
  "amendment.write",
  "record.correct", // office correction of any unsigned record
  "digest.manage",
  "digest.read", // the digest page: the office sees every recipient, an owner their own row
  "digest.subscribe", // change one's own digest row (hour, empty days, unsubscribe)
  "report.export",
] as const;
export type Action = (typeof ACTIONS)[number];

/** Organisation-level actions, decided by the admin flag only. */
export const ADMIN_ACTIONS = ["admin.users", "admin.projects", "admin.invite"] as const;
export type AdminAction = (typeof ADMIN_ACTIONS)[number];

const FIELD_WRITES: Action[] = [
  "placement.write",
  "placement.markReady",
  "placement.start",
  "delivery.write",
  "weather.write",
  "checklist.write",
  "curing.write",
  "diary.write",
  "diary.submit",
  "photo.add",
  "finding.answer",
];

const INSPECTOR: Action[] = [
  "placement.review",
  "placement.sign",
  "fieldTest.write",
  "specimen.write",
  "weather.write",
  "checklist.write",
  "photo.add",
  "visit.write",
  "finding.close",
  "visit.sign",
  "amendment.write",
];

const OFFICE: Action[] = [
  "mix.write",
  "break.write",
  "record.correct",
  "amendment.write",
  "digest.manage",
  "digest.read",
  "photo.add",
];

const READ: Action[] = ["project.read", "report.export"];

export const PERMISSIONS: Record<ProjectRole, ReadonlySet<Action>> = {
  superintendent: new Set([...READ, ...FIELD_WRITES]),
  inspector: new Set([...READ, ...INSPECTOR]),
  office: new Set([...READ, ...OFFICE]),
  owner: new Set([...READ, "digest.read", "digest.subscribe"]),
};

export type Subject = { isAdmin: boolean };

/**
 * May a user holding `role` on a project (null: not a member) do `action` there?
 * The admin flag manages users, projects and memberships; it grants no access to a project's
 * records: an admin reads or writes them only through a membership, like everyone else.
 */
export function can(subject: Subject, action: Action | AdminAction, role: ProjectRole | null): boolean {
  if ((ADMIN_ACTIONS as readonly string[]).includes(action)) return subject.isAdmin;
  if (action === "project.manage") return subject.isAdmin;
  if (role === null) return false;
  return PERMISSIONS[role].has(action as Action);
}
