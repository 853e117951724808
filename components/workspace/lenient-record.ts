/**
 * The record the live checks run on while a designer is half-way through a
 * row. A field error would otherwise freeze every check; instead the rows
 * (or optional site fields) that do not parse are left out, named, and the
 * rest is checked. Pure, so it runs in the browser and in unit tests.
 */
import { projectRecordSchema, type ProjectRecord } from "@/lib/schemas/project-record";

export interface LenientParse {
  record: ProjectRecord | null;
  /** Every field error of the record as the designer entered it. */
  issues: { path: string; message: string }[];
  /** Record paths of rows or fields left out of this run ("circuits.2", "site.designLowTempC"). */
  omitted: string[];
}

const ROW_ARRAYS = new Set(["equipment", "arrays", "circuits", "loads", "attachments"]);
const OPTIONAL_TOP = new Set(["daysOfAutonomy", "rapidShutdownMethod", "rapidShutdownInsideBoundary", "pvGroundingConfiguration", "client"]);
/** Dropping a row can break references to it; a few rounds settle any chain in practice. */
const MAX_ROUNDS = 6;

const pathOf = (p: readonly PropertyKey[]) => p.map(String).join(".");

export function parseLenient(values: unknown): LenientParse {
  const first = projectRecordSchema.safeParse(values);
  if (first.success) return { record: first.data, issues: [], omitted: [] };
  const issues = first.error.issues.map((i) => ({ path: pathOf(i.path) || "(record)", message: i.message }));
  const working = structuredClone(values) as Record<string, unknown>;
  const omitted: string[] = [];
  // Remember where each row stood in the designer's record (zod strips the key again).
  for (const key of ROW_ARRAYS) {
    const rows = working[key];
    if (!Array.isArray(rows)) continue;
    rows.forEach((row, i) => {
      if (row && typeof row === "object") (row as { __index?: number }).__index = i;
    });
  }
  let error = first.error;
  for (let round = 0; round < MAX_ROUNDS; round++) {
    const dropRows = new Map<string, Set<number>>();
    let changed = false;
    for (const issue of error.issues) {
      const [head, second] = issue.path;
      if (typeof head === "string" && ROW_ARRAYS.has(head) && typeof second === "number") {
        const set = dropRows.get(head) ?? new Set<number>();
        set.add(second);
        dropRows.set(head, set);
      } else if (head === "site" && typeof second === "string") {
        const site = working.site as Record<string, unknown> | undefined;
        if (site && second in site && site[second] !== undefined) {
          // Required site fields cannot be left out; the record stays unchecked then.
          if (second === "occupancy" || second === "mounting") return { record: null, issues, omitted };
          delete site[second];
          omitted.push(`site.${second}`);
          changed = true;
        }
      } else if (head === "grounding" && typeof second === "string" && second !== "gecMaterial") {
        // Every grounding field but the material is optional: leave the bad one out, the check asks for it.
        const grounding = working.grounding as Record<string, unknown> | undefined;
        if (grounding && second in grounding && grounding[second] !== undefined) {
          delete grounding[second];
          omitted.push(`grounding.${second}`);
          changed = true;
        }
      } else if (typeof head === "string" && OPTIONAL_TOP.has(head) && issue.path.length === 1) {
        delete working[head];
        omitted.push(head);
        changed = true;
      } else {
        return { record: null, issues, omitted };
      }
    }
    for (const [key, indices] of dropRows) {
      const rows = working[key];
      if (!Array.isArray(rows)) continue;
      // Omitted paths name rows as the designer numbers them, so map back through earlier drops.
      const kept: unknown[] = [];
      rows.forEach((row, i) => {
        if (indices.has(i)) {
          const original = (row as { __index?: number }).__index ?? i;
          omitted.push(`${key}.${original}`);
          changed = true;
        } else {
          kept.push(row);
        }
      });
      working[key] = kept;
    }
    if (!changed) return { record: null, issues, omitted };
    const next = projectRecordSchema.safeParse(working);
    if (next.success) return { record: next.data, issues, omitted: [...new Set(omitted)] };
    error = next.error;
  }
  return { record: null, issues, omitted };
}
