"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

export interface NavItem {
  href: string;
  label: string;
}

export function NavLinks({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <ul className="flex flex-wrap gap-1">
      {items.map((item) => {
        const current = pathname === item.href || pathname.startsWith(`${item.href}/`);
        return (
          <li key={item.href}>
            <Link
              href={item.href}
              aria-current={current ? "page" : undefined}
              className={
                "block rounded-md px-3 py-1.5 text-sm font-medium focus-visible:outline-2 focus-visible:outline-teal-600 " +
                (current ? "bg-teal-50 text-teal-900" : "text-stone-600 hover:bg-stone-100 hover:text-stone-900")
              }
            >
              {item.label}
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
