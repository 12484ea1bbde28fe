import { memberRoute } from "@/lib/authz/route";
import { permissionsOf } from "@/lib/authz/permissions";

/** Who the caller is and what they may do: the quickest check that a session or an API token works. */
export const GET = memberRoute("data:read", (_request, { member }) =>
  Response.json({
    user: member.user,
    group: member.group,
    role: member.role,
    permissions: permissionsOf(member.role),
    via: member.via,
  }),
);
