import type { Role } from "@/lib/auth/roles";

export interface NavLink {
  href: string;
  label: string;
  roles: Role[];
}

/** The side navigation; each link shows to the roles that work there. */
export const NAV_LINKS: NavLink[] = [
  { href: "/projects", label: "Projects", roles: ["designer", "reviewer", "office", "admin"] },
  { href: "/library", label: "Equipment library", roles: ["designer"] },
  { href: "/reviews", label: "Review queue", roles: ["reviewer"] },
  { href: "/reviews/licence", label: "Licence and stamp", roles: ["reviewer"] },
  { href: "/submissions", label: "Submissions", roles: ["office", "designer"] },
  { href: "/jurisdictions", label: "Jurisdictions", roles: ["office", "designer", "reviewer"] },
  { href: "/install", label: "Approved sets", roles: ["installer", "office"] },
  { href: "/outbox", label: "Outbox", roles: ["office", "admin"] },
  { href: "/admin/users", label: "Users", roles: ["admin"] },
];

export function linksFor(roles: readonly Role[]): NavLink[] {
  return NAV_LINKS.filter((link) => link.roles.some((r) => roles.includes(r)));
}
