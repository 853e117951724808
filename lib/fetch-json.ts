/** Client-side JSON fetch that turns a refusal into an Error carrying the server's message and field issues. */
export class RequestError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly issues: { path: string; message: string }[] = [],
  ) {
    super(message);
  }
}

export async function fetchJson<T>(input: string, init?: RequestInit): Promise<T> {
  const response = await fetch(input, { ...init, headers: { accept: "application/json", ...(init?.headers ?? {}) } });
  const body = (await response.json().catch(() => null)) as { error?: string; issues?: { path: string; message: string }[] } | null;
  if (!response.ok) {
    throw new RequestError(body?.error ?? `The server answered ${response.status}.`, response.status, body?.issues ?? []);
  }
  return body as T;
}
