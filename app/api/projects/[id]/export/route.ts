import { defineRoute } from "@/lib/http";
import { getProjectRecord } from "@/lib/services/projects/get-record";

/** File names keep to letters, digits and dashes so every browser and file system takes them. */
function fileName(name: string): string {
  const slug = name
    .normalize("NFKD")
    .replace(/[^\w\s-]/g, "")
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, "-")
    .replace(/-+/g, "-")
    .slice(0, 80);
  return `${slug || "project"}.sundocket.json`;
}

/** The stored record as a project file download (the same format the check command and import read). */
export const GET = defineRoute({
  access: "user",
  run: ({ ctx, params }) => {
    const { record } = getProjectRecord(ctx, params.id ?? "");
    return new Response(JSON.stringify(record, null, 2) + "\n", {
      headers: {
        "content-type": "application/json; charset=utf-8",
        "content-disposition": `attachment; filename="${fileName(record.name)}"`,
        "cache-control": "no-store",
      },
    });
  },
});
