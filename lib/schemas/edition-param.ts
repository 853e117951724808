import { necEditionSchema } from "./project-record";

/** Reads `?edition=` from a URL: undefined when absent, an error message when not an edition. */
export function editionParam(url: string): { ok: true; edition?: "2017" | "2020" | "2023" } | { ok: false; message: string } {
  const raw = new URL(url).searchParams.get("edition");
  if (raw === null || raw === "") return { ok: true };
  const parsed = necEditionSchema.safeParse(raw);
  return parsed.success ? { ok: true, edition: parsed.data } : { ok: false, message: "edition must be one of 2017, 2020, 2023" };
}
