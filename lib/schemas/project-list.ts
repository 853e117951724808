import { z } from "zod";
import { PROJECT_STATUSES } from "./project-status";
import { SYSTEM_KINDS } from "./project-record";

export const PROJECT_SORTS = ["updated", "name"] as const;
export const PROJECT_SORT_LABELS: Record<(typeof PROJECT_SORTS)[number], string> = {
  updated: "Last changed first",
  name: "Name A–Z",
};

/** What the projects list can be narrowed and ordered by; every filter is applied by the server. */
export const projectListQuerySchema = z.object({
  q: z.string().trim().max(100, { message: "search for at most 100 characters" }).default(""),
  status: z.enum(PROJECT_STATUSES, { error: "not a project status" }).optional(),
  jurisdictionId: z.string().max(64).optional(),
  systemKind: z.enum(SYSTEM_KINDS, { error: "not a system kind" }).optional(),
  archived: z.boolean().default(false),
  sort: z.enum(PROJECT_SORTS, { error: "sort by updated or name" }).default("updated"),
});
export type ProjectListQuery = z.input<typeof projectListQuerySchema>;

/** Reads the list query from URL search parameters; an empty parameter means "any". */
export function projectListQueryFrom(params: URLSearchParams): Record<string, unknown> {
  const value = (key: string) => {
    const v = params.get(key);
    return v === null || v === "" ? undefined : v;
  };
  return {
    q: value("q"),
    status: value("status"),
    jurisdictionId: value("jurisdiction"),
    systemKind: value("kind"),
    archived: params.get("archived") === "1",
    sort: value("sort"),
  };
}
