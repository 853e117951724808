/**
 * Renders one packet revision: `npx tsx scripts/generate-revision.ts <revisionId>`.
 * Started detached by the web server when a designer generates a packet, so
 * the rendering runs outside the request. Exits 0 when the revision is ready.
 */
import { getDb } from "../db/client";
import { generateRevisionArtifacts } from "../lib/services/revisions/generate";

async function main() {
  const revisionId = process.argv[2];
  if (!revisionId) {
    console.error("usage: tsx scripts/generate-revision.ts <revisionId>");
    process.exit(2);
  }
  const db = getDb();
  const row = await generateRevisionArtifacts(db, revisionId);
  db.$client.close();
  if (row.state !== "ready") {
    console.error(`Revision ${row.number}: ${row.error ?? row.state}`);
    process.exit(1);
  }
  console.log(`Revision ${row.number}: ${row.pageCount} pages, PDF ${row.pdfSha256}, DOCX ${row.docxSha256}`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
