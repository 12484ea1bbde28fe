import { requirePageMember } from "@/lib/authz/page";
import { Badge } from "@/components/ui/badge";
import { formatDateTime } from "@/components/ui/format";
import { Card, PageHeader } from "@/components/ui/page-header";
import { CreateApiTokenForm, RevokeApiTokenForm } from "@/lib/auth/components/api-token-controls";
import { listApiTokens } from "@/lib/auth/api-tokens/tokens";

export const metadata = { title: "API tokens" };

export default async function ApiTokensPage() {
  const member = await requirePageMember("tokens:manage", { returnTo: "/settings/api-tokens" });
  const tokens = await listApiTokens(member);
  return (
    <>
      <PageHeader
        title="Settings → API tokens"
        description={`Personal tokens for scripts and instruments that talk to the Layerwise API on your behalf in ${member.group.name}. A token can do what your role allows, and stops working if you leave the group.`}
      />
      <div className="space-y-6">
        <Card title="New token">
          <CreateApiTokenForm />
        </Card>
        <Card title="Your tokens">
          {tokens.length === 0 ? (
            <p className="text-sm text-stone-500">You have no API tokens in this group.</p>
          ) : (
            <ul className="divide-y divide-stone-100">
              {tokens.map((t) => (
                <li key={t.id} className="flex flex-wrap items-center justify-between gap-3 py-3 text-sm">
                  <div>
                    <p className="font-medium text-stone-900">
                      {t.name} <span className="font-mono text-xs text-stone-500">{t.prefix}…</span>
                    </p>
                    <p className="text-stone-500">
                      Created {formatDateTime(t.createdAt)} · {t.lastUsedAt ? `last used ${formatDateTime(t.lastUsedAt)}` : "never used"} ·{" "}
                      {t.expiresAt ? `valid until ${formatDateTime(t.expiresAt)}` : "no expiry"}
                    </p>
                  </div>
                  {t.revokedAt ? <Badge>Revoked {formatDateTime(t.revokedAt)}</Badge> : <RevokeApiTokenForm tokenId={t.id} name={t.name} />}
                </li>
              ))}
            </ul>
          )}
        </Card>
      </div>
    </>
  );
}
