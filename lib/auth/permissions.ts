import type { Role } from "./roles";

/**
 * The one place that says which role may do what. Services call `can` /
 * `requirePermission` on their first line; pages use `can` only to hide
 * controls, never as the guard.
 */
export const PERMISSIONS = {
  "project:read": ["designer", "reviewer", "office", "admin"],
  "project:create": ["designer"],
  "project:edit": ["designer"],
  "library:read": ["designer", "reviewer", "office", "admin"],
  "library:edit": ["designer"],
  "attachment:upload": ["designer", "reviewer", "installer"],
  "attachment:delete": ["designer"],
  "packet:generate": ["designer"],
  "packet:read": ["designer", "reviewer", "office", "installer", "admin"],
  "review:send": ["designer"],
  "review:read": ["designer", "reviewer", "office", "admin"],
  "review:decide": ["reviewer"],
  "licence:edit-own": ["reviewer"],
  "jurisdiction:read": ["designer", "reviewer", "office", "admin"],
  "jurisdiction:edit": ["office"],
  "submission:read": ["designer", "office", "admin"],
  "submission:create": ["office"],
  "submission:record-event": ["office"],
  /** Corrections an AHJ asked for, worked as items: read by the project's roles, answered by design and review. */
  "correction:read": ["designer", "reviewer", "office", "admin"],
  "correction:resolve": ["designer", "reviewer"],
  "correction:assign": ["designer", "reviewer", "office"],
  "install:read": ["installer", "office", "admin"],
  "install:confirm": ["installer"],
  "users:manage": ["admin"],
  "outbox:read": ["office", "admin"],
  "audit:read": ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(roles: readonly Role[], permission: Permission): boolean {
  const allowed: readonly Role[] = PERMISSIONS[permission];
  return roles.some((role) => allowed.includes(role));
}
