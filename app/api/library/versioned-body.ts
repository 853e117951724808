/** Reads `{ version, item }` from an edit request; the services refuse what is missing. */
export function versionedBody(body: unknown): { version: number | undefined; item: unknown } {
  if (typeof body !== "object" || body === null) return { version: undefined, item: undefined };
  const b = body as { version?: unknown; item?: unknown };
  return { version: typeof b.version === "number" ? b.version : undefined, item: b.item };
}
