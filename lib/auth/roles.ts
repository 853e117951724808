export const ROLES = ["designer", "reviewer", "office", "installer", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  designer: "Designer",
  reviewer: "Reviewer",
  office: "Permit office",
  installer: "Installer",
  admin: "Administrator",
};

/** Where each role starts its day; the first role a user holds in this order wins. */
export const ROLE_HOME: Record<Role, string> = {
  designer: "/projects",
  reviewer: "/reviews",
  office: "/submissions",
  installer: "/install",
  admin: "/admin/users",
};

export function homeFor(roles: readonly Role[]): string {
  for (const role of ROLES) if (roles.includes(role)) return ROLE_HOME[role];
  return "/account";
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}
