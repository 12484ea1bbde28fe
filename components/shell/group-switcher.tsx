"use client";
import { useSession } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useId, useState, useTransition } from "react";

export interface SwitcherGroup {
  id: string;
  name: string;
}

/**
 * Changes the session's active group. The server checks the membership before it accepts the change
 * (lib/auth/options.ts, jwt callback), and the guard checks it again on every request.
 */
export function GroupSwitcher({ groups, activeGroupId }: { groups: SwitcherGroup[]; activeGroupId: string }) {
  const id = useId();
  const router = useRouter();
  const { update } = useSession();
  const [pending, startTransition] = useTransition();
  const [failed, setFailed] = useState(false);

  function choose(groupId: string) {
    startTransition(async () => {
      const session = await update({ activeGroupId: groupId });
      setFailed(session?.activeGroupId !== groupId);
      router.push("/workups");
      router.refresh();
    });
  }

  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="sr-only">
        Active group
      </label>
      <select
        id={id}
        value={activeGroupId}
        disabled={pending}
        onChange={(e) => choose(e.target.value)}
        className="rounded-md border border-stone-300 bg-white py-1 pl-2 pr-7 text-sm font-medium text-stone-900 focus:outline-2 focus:outline-teal-600"
      >
        {groups.map((g) => (
          <option key={g.id} value={g.id}>
            {g.name}
          </option>
        ))}
      </select>
      {failed ? <span role="alert" className="text-xs text-red-700">Could not switch group.</span> : null}
    </div>
  );
}
