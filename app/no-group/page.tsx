import { redirect } from "next/navigation";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { listMyGroups } from "@/lib/groups/queries";
import { requirePageUser } from "@/lib/authz/page";

export const metadata = { title: "No group yet" };

export default async function NoGroupPage() {
  const user = await requirePageUser("/no-group");
  if ((await listMyGroups(user.id)).length > 0) redirect("/workups");
  return (
    <main className="flex min-h-screen items-center justify-center bg-stone-50 px-4">
      <div className="w-full max-w-md rounded-lg border border-stone-200 bg-white p-6 text-center shadow-xs">
        <h1 className="text-xl font-semibold text-stone-900">You are not in a group yet</h1>
        <p className="mt-3 text-sm text-stone-600">
          Signed in as {user.email}. Records in Layerwise belong to a group; ask a group lead for an invite link and open it while
          signed in.
        </p>
        <div className="mt-6">
          <SignOutButton />
        </div>
      </div>
    </main>
  );
}
