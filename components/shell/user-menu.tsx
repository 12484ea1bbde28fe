"use client";
import Link from "next/link";
import { signOut } from "next-auth/react";
import { useRef } from "react";

/** A disclosure menu (native <details>, so it opens with Enter/Space and closes with Escape). */
export function UserMenu({ name, email, roleLabel }: { name: string; email: string; roleLabel: string }) {
  const menu = useRef<HTMLDetailsElement>(null);
  return (
    <details
      ref={menu}
      className="relative"
      onKeyDown={(e) => {
        if (e.key === "Escape" && menu.current?.open) {
          menu.current.open = false;
          menu.current.querySelector("summary")?.focus();
        }
      }}
    >
      <summary data-testid="user-menu" className="flex cursor-pointer list-none items-center gap-2 rounded-md px-2 py-1.5 text-sm text-stone-700 hover:bg-stone-100 focus-visible:outline-2 focus-visible:outline-teal-600">
        <span aria-hidden className="flex h-7 w-7 items-center justify-center rounded-full bg-teal-700 text-xs font-semibold text-white">
          {initials(name)}
        </span>
        <span className="hidden sm:inline">{name}</span>
        <span className="sr-only">Open account menu</span>
      </summary>
      <div className="absolute right-0 z-20 mt-2 w-64 rounded-lg border border-stone-200 bg-white p-2 shadow-lg">
        <div className="border-b border-stone-100 px-2 pb-2">
          <p className="text-sm font-medium text-stone-900">{name}</p>
          <p className="truncate text-xs text-stone-500">{email}</p>
          <p className="mt-1 text-xs text-stone-500">Role in this group: {roleLabel}</p>
        </div>
        <ul className="pt-1">
          <li>
            <Link href="/settings/api-tokens" className="block rounded-md px-2 py-1.5 text-sm text-stone-700 hover:bg-stone-100 focus-visible:outline-2 focus-visible:outline-teal-600">
              Settings → API tokens
            </Link>
          </li>
          <li>
            <Link href="/settings/password" className="block rounded-md px-2 py-1.5 text-sm text-stone-700 hover:bg-stone-100 focus-visible:outline-2 focus-visible:outline-teal-600">
              Settings → Password
            </Link>
          </li>
          <li>
            <button
              type="button"
              onClick={() => void signOut({ callbackUrl: "/sign-in" })}
              className="block w-full rounded-md px-2 py-1.5 text-left text-sm text-stone-700 hover:bg-stone-100 focus-visible:outline-2 focus-visible:outline-teal-600"
            >
              Sign out
            </button>
          </li>
        </ul>
      </div>
    </details>
  );
}

function initials(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  const letters = parts.length > 1 ? [parts[0]?.[0], parts[parts.length - 1]?.[0]] : [parts[0]?.[0], parts[0]?.[1]];
  return letters.filter(Boolean).join("").toUpperCase() || "?";
}
