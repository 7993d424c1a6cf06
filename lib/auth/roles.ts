export const PROJECT_ROLES = ["superintendent", "inspector", "office", "owner"] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const ROLE_LABELS: Record<ProjectRole, string> = {
  superintendent: "Superintendent",
  inspector: "Inspector",
  office: "Office",
  owner: "Owner",
};
