import { type ReactNode } from "react";
import { AppShell } from "@/components/shell/app-shell";
import { Providers } from "@/components/shell/providers";
import { requireMember, signedInGroups, type MemberContext } from "@/lib/authz";
import { pageFailure } from "@/lib/authz/page";
import { UnauthenticatedError } from "@/lib/errors";

/**
 * The signed-in frame. It only decides what the frame shows: every page below runs its own guard, because a
 * layout is not re-rendered on every navigation and so cannot protect the pages inside it. The frame's membership and
 * the group switcher's list come from the one account read the page's own guard uses in the same request.
 */
export default async function SignedInLayout({ children }: { children: ReactNode }) {
  let member: MemberContext;
  try {
    member = await requireMember("data:read", { sessionOnly: true });
  } catch (error) {
    // Signed out: the page redirects to sign-in with its own return path.
    if (error instanceof UnauthenticatedError) return <>{children}</>;
    pageFailure(error);
  }
  const groups = await signedInGroups();
  return (
    <Providers>
      <AppShell member={member} groups={groups}>
        {children}
      </AppShell>
    </Providers>
  );
}
