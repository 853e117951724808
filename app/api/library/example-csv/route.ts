import fs from "node:fs/promises";
import path from "node:path";
import { defineRoute } from "@/lib/http";

/** GET /api/library/example-csv → examples/equipment-library.csv as a download, the template for an import. */
export const GET = defineRoute({
  access: "user",
  permission: "library:read",
  run: async () => {
    const text = await fs.readFile(path.join(process.cwd(), "examples", "equipment-library.csv"), "utf8");
    return new Response(text, {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": 'attachment; filename="equipment-library.csv"',
      },
    });
  },
});
