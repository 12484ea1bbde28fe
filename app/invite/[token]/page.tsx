import Link from "next/link";
import { Providers } from "@/components/shell/providers";
import { buttonClass } from "@/components/ui/button";
import { formatDate } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { currentUser, ROLE_LABELS } from "@/lib/authz";
import { signInPath } from "@/lib/authz/page";
import { JoinAsSignedIn, JoinWithNewAccount } from "@/lib/groups/components/accept-invite";
import { previewInvite } from "@/lib/groups/invites";

export const metadata = { title: "Join a group" };

/** Public page: the invite link itself is the authority to join; everything else still goes through the guard. */
export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const [invite, user] = await Promise.all([previewInvite(token), currentUser()]);
  return (
    <main className="flex min-h-screen items-center justify-center bg-stone-50 px-4 py-12">
      <div className="w-full max-w-md rounded-lg border border-stone-200 bg-white p-6 shadow-xs">
        <p className="text-sm font-semibold text-teal-700">Layerwise</p>
        {!invite ? (
          <>
            <h1 className="mt-1 text-xl font-semibold text-stone-900">This invite cannot be used</h1>
            <div className="mt-4">
              <Notice tone="warning">It may have been used already, revoked or expired. Ask your group lead for a new link.</Notice>
            </div>
          </>
        ) : (
          <>
            <h1 className="mt-1 text-xl font-semibold text-stone-900">Join {invite.groupName}</h1>
            <p className="mt-2 text-sm text-stone-600">
              You are invited as {ROLE_LABELS[invite.role].toLowerCase()}. The link works once and expires on {formatDate(invite.expiresAt)}.
            </p>
            <div className="mt-6">
              {user ? (
                <Providers>
                  <p className="mb-4 text-sm text-stone-600">Signed in as {user.email}.</p>
                  <JoinAsSignedIn token={token} groupName={invite.groupName} />
                </Providers>
              ) : (
                <>
                  <JoinWithNewAccount token={token} />
                  <p className="mt-6 border-t border-stone-100 pt-4 text-sm text-stone-600">
                    Already have a Layerwise account?{" "}
                    <Link href={signInPath(`/invite/${token}`)} className={buttonClass("ghost", "px-1 py-0.5 text-teal-800")}>
                      Sign in first
                    </Link>
                  </p>
                </>
              )}
            </div>
          </>
        )}
      </div>
    </main>
  );
}
