/**
 * Typed service errors, mapped to HTTP once at the edge (lib/http.ts).
 * Messages are safe to show: they never carry another organisation's data.
 */
export type ServiceErrorCode = "unauthenticated" | "forbidden" | "not-found" | "conflict" | "invalid" | "locked" | "too-large";

export interface FieldIssue {
  path: string;
  message: string;
}

export class ServiceError extends Error {
  constructor(
    readonly code: ServiceErrorCode,
    message: string,
    readonly issues: FieldIssue[] = [],
  ) {
    super(message);
    this.name = "ServiceError";
  }
}

export const unauthenticated = () => new ServiceError("unauthenticated", "Sign in to continue.");
export const forbidden = (what = "do this") => new ServiceError("forbidden", `Your role does not allow you to ${what}.`);
/** Used for rows of another organisation too, so their existence does not leak. */
export const notFound = (what: string) => new ServiceError("not-found", `${what} was not found.`);
export const conflict = (message: string) => new ServiceError("conflict", message);
export const invalid = (message: string, issues: FieldIssue[] = []) => new ServiceError("invalid", message, issues);
/** A request body past its bound, refused before the rest of it was read. */
export const tooLarge = (message: string) => new ServiceError("too-large", message);

export const HTTP_STATUS: Record<ServiceErrorCode, number> = {
  unauthenticated: 401,
  forbidden: 403,
  "not-found": 404,
  conflict: 409,
  invalid: 400,
  locked: 423,
  "too-large": 413,
};
