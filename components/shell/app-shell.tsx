import Link from "next/link";
import { type ReactNode } from "react";
import { type MemberContext } from "@/lib/authz/guard";
import { ROLE_LABELS } from "@/lib/authz/permissions";
import { GroupSwitcher, type SwitcherGroup } from "@/components/shell/group-switcher";
import { NavLinks, type NavItem } from "@/components/shell/nav-links";
import { UserMenu } from "@/components/shell/user-menu";

export const NAV_ITEMS: NavItem[] = [
  { href: "/workups", label: "Workups" },
  { href: "/compounds", label: "Compounds" },
  { href: "/search", label: "Search" },
  { href: "/review", label: "Review" },
  { href: "/partition", label: "Partition data" },
  { href: "/library", label: "Library" },
  { href: "/members", label: "Members" },
];

export function AppShell({ member, groups, children }: { member: MemberContext; groups: SwitcherGroup[]; children: ReactNode }) {
  return (
    <div className="min-h-screen bg-stone-50">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-3 focus:top-3 focus:z-50 focus:rounded-md focus:bg-white focus:px-3 focus:py-2 focus:shadow">
        Skip to content
      </a>
      <header className="border-b border-stone-200 bg-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2.5">
          <Link href="/workups" className="flex items-center gap-2 rounded-md font-semibold tracking-tight text-stone-900 focus-visible:outline-2 focus-visible:outline-teal-600">
            <LayersMark />
            Layerwise
          </Link>
          {groups.length > 1 ? (
            <GroupSwitcher groups={groups} activeGroupId={member.group.id} />
          ) : (
            <span className="text-sm font-medium text-stone-600" data-testid="group-name">
              {member.group.name}
            </span>
          )}
          <nav aria-label="Main" className="order-last w-full sm:order-none sm:w-auto sm:flex-1">
            <NavLinks items={NAV_ITEMS} />
          </nav>
          <div className="ml-auto">
            <UserMenu name={member.user.name} email={member.user.email} roleLabel={ROLE_LABELS[member.role]} />
          </div>
        </div>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto max-w-6xl px-4 py-8 focus:outline-none">
        {children}
      </main>
    </div>
  );
}

/** Two stacked liquid layers in a funnel outline. */
function LayersMark() {
  return (
    <svg aria-hidden viewBox="0 0 24 24" className="h-6 w-6">
      <path d="M4 3h16l-6 9v6l-4 3v-9z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" className="text-stone-700" />
      <path d="M6.2 6.3h11.6l-1.9 2.8H8.1z" className="fill-amber-300" />
      <path d="M8.1 9.1h7.8L14 12h-4z" className="fill-teal-500" />
    </svg>
  );
}
