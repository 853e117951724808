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

/** Each permission as the end of "Your role does not allow you to …", for a refusal made before a service names it itself. */
export const PERMISSION_WORDS: Record<Permission, string> = {
  "project:read": "read projects",
  "project:create": "create projects",
  "project:edit": "edit projects",
  "library:read": "read the equipment library",
  "library:edit": "edit the equipment library",
  "attachment:upload": "attach files",
  "attachment:delete": "delete attachments",
  "packet:generate": "generate packets",
  "packet:read": "read packets",
  "review:send": "send revisions for review",
  "review:read": "read reviews",
  "review:decide": "decide reviews",
  "licence:edit-own": "keep a licence record",
  "jurisdiction:read": "read jurisdictions",
  "jurisdiction:edit": "edit jurisdictions",
  "submission:read": "read submissions",
  "submission:create": "submit packets to a jurisdiction",
  "submission:record-event": "record submission events",
  "install:read": "read approved sets",
  "install:confirm": "confirm installed items",
  "users:manage": "manage users",
  "outbox:read": "read the outbox",
  "audit:read": "read the audit log",
  "correction:read": "read corrections",
  "correction:resolve": "resolve corrections",
  "correction:assign": "assign corrections",
};

export function can(roles: readonly Role[], permission: Permission): boolean {
  const allowed: readonly Role[] = PERMISSIONS[permission];
  return roles.some((role) => allowed.includes(role));
}
