import fs from "node:fs/promises";
import path from "node:path";
import { requireContext } from "@/lib/auth/session";
import { handle } from "@/lib/http";
import { requirePermission } from "@/lib/services/context";

/** GET /api/library/example-csv → examples/equipment-library.csv as a download, the template for an import. */
export const GET = handle(async () => {
  const ctx = await requireContext();
  requirePermission(ctx, "library:read", "read the equipment library");
  const text = await fs.readFile(path.join(process.cwd(), "examples", "equipment-library.csv"), "utf8");
  return new Response(text, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": 'attachment; filename="equipment-library.csv"',
    },
  });
});
