import Link from "next/link";
import { BrandMark } from "@/components/ui/brand-mark";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { CautionBar } from "./caution-bar";
import { linksFor } from "./nav-links";
import { SideNav } from "./side-nav";
import { SignOutButton } from "./sign-out-button";

export function AppShell({
  user,
  orgName,
  roles,
  children,
}: {
  user: { name: string; email: string };
  orgName: string;
  roles: Role[];
  children: React.ReactNode;
}) {
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-sheet focus:px-3 focus:py-1">
        Skip to content
      </a>
      <header className="no-print flex items-center justify-between border-b-2 border-ink bg-sheet px-4 py-2">
        <Link href="/" className="flex items-center gap-2 text-slate">
          <BrandMark />
          <span className="text-base font-semibold tracking-tight text-ink">Sundocket</span>
          <span className="hidden border-l border-rule pl-2 text-xs text-ink-soft sm:inline">{orgName}</span>
        </Link>
        <div className="flex items-center gap-3 text-sm">
          <span className="hidden text-right sm:block">
            <span className="block font-medium leading-tight">{user.name}</span>
            <span className="block text-xs leading-tight text-ink-soft">{roles.map((r) => ROLE_LABELS[r]).join(" · ")}</span>
          </span>
          <Link href="/account/password" className="btn-quiet">
            Password
          </Link>
          <SignOutButton />
        </div>
      </header>
      <div className="flex flex-1">
        <aside className="no-print w-52 shrink-0 border-r border-rule bg-paper py-4">
          <SideNav links={linksFor(roles)} />
        </aside>
        <main id="main" className="min-w-0 flex-1 px-6 py-5">
          {children}
        </main>
      </div>
      <footer className="no-print">
        <CautionBar />
      </footer>
    </div>
  );
}
