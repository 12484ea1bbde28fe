// Roles and what they may do, as data. Adding a permission means adding it to PERMISSIONS and to the roles that hold
// it; a role that is not in ROLE_PERMISSIONS holds nothing (fail closed), even if the database ever returns one.
import { ForbiddenError } from "@/lib/errors";
import { type RoleName } from "@/lib/authz/roles";

export const PERMISSIONS = [
  /** See the group's workups, compounds, predictions, partition data and member list. */
  "data:read",
  /** Create and edit workups, outcomes, compounds and partition observations. */
  "data:write",
  /** Edit the group's solvent and wash library and exclude partition observations. */
  "library:manage",
  /** Invite people, change roles, remove members. */
  "members:manage",
  /** Create and revoke one's own API tokens. */
  "tokens:manage",
] as const;

export type Permission = (typeof PERMISSIONS)[number];

export { ROLES, ROLE_LABELS, type RoleName } from "@/lib/authz/roles";

const ROLE_PERMISSIONS: Readonly<Record<RoleName, readonly Permission[]>> = {
  lead: ["data:read", "data:write", "library:manage", "members:manage", "tokens:manage"],
  member: ["data:read", "data:write", "tokens:manage"],
  viewer: ["data:read", "tokens:manage"],
};

export function isRoleName(role: string): role is RoleName {
  return Object.hasOwn(ROLE_PERMISSIONS, role);
}

export function roleCan(role: string, permission: Permission): boolean {
  return isRoleName(role) && ROLE_PERMISSIONS[role].includes(permission);
}

/** Throws ForbiddenError unless the role holds the permission; an unknown role is refused outright. */
export function assertRoleCan(role: string, permission: Permission): asserts role is RoleName {
  if (!isRoleName(role)) throw new ForbiddenError("Your membership has a role Layerwise does not recognise.");
  if (!roleCan(role, permission)) throw new ForbiddenError(refusal(permission));
}

function refusal(permission: Permission): string {
  switch (permission) {
    case "data:write":
      return "Viewers can read the group's records but not change them.";
    case "members:manage":
      return "Only a group lead can manage members and invites.";
    case "library:manage":
      return "Only a group lead can edit the solvent and wash library.";
    default:
      return "Your role in this group does not allow this.";
  }
}

export function permissionsOf(role: string): readonly Permission[] {
  return isRoleName(role) ? ROLE_PERMISSIONS[role] : [];
}
