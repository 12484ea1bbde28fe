import { can, ROLE_LABELS } from "@/lib/authz";
import { requirePageMember } from "@/lib/authz/page";
import { Badge } from "@/components/ui/badge";
import { formatDate } from "@/components/ui/format";
import { Card, PageHeader } from "@/components/ui/page-header";
import { InviteForm } from "@/lib/groups/components/invite-form";
import { LiftSignInDelayForm } from "@/lib/auth/components/lift-delay-form";
import { RemoveMemberForm, RevokeInviteForm, RoleForm } from "@/lib/groups/components/member-controls";
import { listPendingInvites } from "@/lib/groups/invites";
import { listMembers } from "@/lib/groups/members";

export const metadata = { title: "Members" };

export default async function MembersPage() {
  const member = await requirePageMember("data:read", { returnTo: "/members" });
  const manages = can(member, "members:manage");
  const [members, invites] = await Promise.all([listMembers(member), manages ? listPendingInvites(member) : Promise.resolve([])]);
  return (
    <>
      <PageHeader
        title="Members"
        description={manages ? `Who is in ${member.group.name}, and what each person may do.` : `Who is in ${member.group.name}. Only a lead can change this list.`}
      />
      <div className="space-y-6">
        <Card title={`${members.length} ${members.length === 1 ? "member" : "members"}`}>
          <ul className="divide-y divide-stone-100">
            {members.map((m) => (
              <li key={m.membershipId} className="flex flex-wrap items-center justify-between gap-3 py-3" data-testid="member-row">
                <div>
                  <p className="font-medium text-stone-900">
                    {m.name} {m.userId === member.user.id ? <span className="text-sm font-normal text-stone-500">(you)</span> : null}
                  </p>
                  <p className="text-sm text-stone-500">{m.email} · joined {formatDate(m.joinedAt)}</p>
                </div>
                {manages ? (
                  <div className="flex flex-wrap items-start gap-2">
                    <RoleForm membershipId={m.membershipId} role={m.role} name={m.name} />
                    <RemoveMemberForm membershipId={m.membershipId} name={m.name} isSelf={m.userId === member.user.id} />
                    {m.userId === member.user.id ? null : <LiftSignInDelayForm membershipId={m.membershipId} />}
                  </div>
                ) : (
                  <Badge tone={m.role === "lead" ? "accent" : "neutral"}>{ROLE_LABELS[m.role]}</Badge>
                )}
              </li>
            ))}
          </ul>
        </Card>
        {manages ? (
          <>
            <Card title="Invite someone">
              <InviteForm />
            </Card>
            <Card title="Open invites">
              {invites.length === 0 ? (
                <p className="text-sm text-stone-500">No invite links are waiting to be used.</p>
              ) : (
                <ul className="divide-y divide-stone-100">
                  {invites.map((i) => (
                    <li key={i.id} className="flex items-center justify-between gap-3 py-2 text-sm">
                      <span>
                        {ROLE_LABELS[i.role]} invite, created {formatDate(i.createdAt)}, expires {formatDate(i.expiresAt)}
                      </span>
                      <RevokeInviteForm inviteId={i.id} />
                    </li>
                  ))}
                </ul>
              )}
            </Card>
          </>
        ) : null}
      </div>
    </>
  );
}
