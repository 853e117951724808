"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { NavLink } from "./nav-links";

export function SideNav({ links }: { links: NavLink[] }) {
  const pathname = usePathname();
  // The longest link that contains the page is the current one (/reviews/licence, not /reviews).
  const current = links
    .filter((link) => pathname === link.href || pathname.startsWith(link.href + "/"))
    .sort((a, b) => b.href.length - a.href.length)[0]?.href;
  return (
    <nav aria-label="Main" className="flex flex-col gap-0.5 text-sm">
      {links.map((link) => {
        const active = link.href === current;
        return (
          <Link
            key={link.href}
            href={link.href}
            aria-current={active ? "page" : undefined}
            className={`border-l-2 px-3 py-1.5 ${
              active ? "border-ink bg-sheet font-semibold text-ink" : "border-transparent text-ink-soft hover:border-rule hover:text-ink"
            }`}
          >
            {link.label}
          </Link>
        );
      })}
    </nav>
  );
}
