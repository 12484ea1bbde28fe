// The role names alone, free of server imports so forms in the browser can use them.
export const ROLES = ["lead", "member", "viewer"] as const;
export type RoleName = (typeof ROLES)[number];

/** What each role is called in the UI. */
export const ROLE_LABELS: Readonly<Record<RoleName, string>> = {
  lead: "Lead",
  member: "Member",
  viewer: "Viewer",
};
