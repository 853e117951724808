import "server-only";
import { eq } from "drizzle-orm";
import { equipmentLibrary } from "../../../db/schema";
import { parseEquipmentCsv, type RowProblem } from "../../equipment-csv/parse";
import { splitLibraryItem, type EquipmentKind } from "../../schemas/library-item";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid } from "../errors";
import { identityKey } from "./view";

/** A library file is text of a few hundred rows; 2 MB is far beyond that and keeps one request bounded. */
export const MAX_CSV_BYTES = 2 * 1024 * 1024;

export interface ImportReport {
  rowsRead: number;
  taken: { row: number; id: string; kind: EquipmentKind; manufacturer: string; model: string }[];
  refused: { row: number; kind: string; manufacturer: string; model: string; problems: RowProblem[] }[];
}

/**
 * Imports a CSV into the organisation's library, row by row: every valid row
 * is taken, every other row is refused with its reasons, and the taken rows
 * are written in one transaction. A file whose header is missing a required
 * column or names a column the import does not understand is refused whole.
 * The seed calls this with examples/equipment-library.csv.
 */
export function importLibraryCsv(ctx: ServiceContext, csvText: string): ImportReport {
  requirePermission(ctx, "library:edit", "edit the equipment library");
  if (Buffer.byteLength(csvText, "utf8") > MAX_CSV_BYTES) {
    throw invalid(`The file is larger than ${MAX_CSV_BYTES / 1024 / 1024} MB; split it and import the parts. Nothing was added.`);
  }
  const parsed = parseEquipmentCsv(csvText);
  if (!parsed.ok) {
    throw invalid(parsed.message, [
      ...parsed.missingColumns.map((column) => ({ path: column, message: "missing column (required)" })),
      ...parsed.columnProblems.map((p) => ({ path: p.column, message: p.message })),
    ]);
  }
  return ctx.db.transaction((tx) => {
    const existing = new Map(
      tx
        .select()
        .from(equipmentLibrary)
        .where(eq(equipmentLibrary.orgId, ctx.orgId))
        .all()
        .map((r) => [identityKey(r.kind, r.manufacturer, r.model), r] as const),
    );
    const inFile = new Map<string, number>();
    const report: ImportReport = { rowsRead: parsed.rows.length, taken: [], refused: [] };
    for (const row of parsed.rows) {
      const problems = [...row.problems];
      if (row.item) {
        const key = identityKey(row.item.kind, row.item.manufacturer, row.item.model);
        const same = existing.get(key);
        const earlier = inFile.get(key);
        if (same) {
          const message = same.retiredAt ? "already in the library, retired; restore it there instead" : "already in the library; edit it there instead";
          problems.push({ column: "model", message, text: `row ${row.row}, model: ${message}` });
        } else if (earlier !== undefined) {
          const message = `the same item as row ${earlier}`;
          problems.push({ column: "model", message, text: `row ${row.row}, model: ${message}` });
        } else {
          inFile.set(key, row.row);
        }
      }
      if (!row.item || problems.length) {
        report.refused.push({ row: row.row, kind: row.kind, manufacturer: row.manufacturer, model: row.model, problems });
        continue;
      }
      const item = splitLibraryItem(row.item);
      const stored = tx
        .insert(equipmentLibrary)
        .values({ orgId: ctx.orgId, ...item })
        .returning({ id: equipmentLibrary.id })
        .get();
      report.taken.push({ row: row.row, id: stored.id, kind: item.kind, manufacturer: item.manufacturer, model: item.model });
    }
    audit(tx, ctx, "library.imported", "equipment-library", null, {
      rowsRead: report.rowsRead,
      taken: report.taken.length,
      refused: report.refused.map((r) => r.row),
    });
    return report;
  });
}
