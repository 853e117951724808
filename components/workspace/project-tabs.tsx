"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/** `openCorrections`: the AHJ comments still open, counted on the tab so they are not missed. */
export function ProjectTabs({ projectId, openCorrections = 0 }: { projectId: string; openCorrections?: number }) {
  const pathname = usePathname();
  const base = `/projects/${projectId}`;
  const tabs = [
    { href: base, label: "Design" },
    { href: `${base}/attachments`, label: "Attachments" },
    { href: `${base}/packet`, label: "Packet" },
    { href: `${base}/corrections`, label: openCorrections > 0 ? `Corrections (${openCorrections} open)` : "Corrections" },
    { href: `${base}/history`, label: "History" },
  ];
  return (
    <nav aria-label="Project" className="no-print mb-4 flex gap-0 border-b border-rule">
      {tabs.map((t) => {
        const current = t.href === base ? pathname === base : pathname.startsWith(t.href);
        return (
          <Link
            key={t.href}
            href={t.href}
            aria-current={current ? "page" : undefined}
            className={`-mb-px border-b-2 px-4 py-2 text-sm ${current ? "border-ink font-semibold text-ink" : "border-transparent text-ink-soft hover:text-ink"}`}
          >
            {t.label}
          </Link>
        );
      })}
    </nav>
  );
}
