import type { PDFFont, PDFPage } from "pdf-lib";
import { layoutOneLine, type DiagramFailure } from "../diagram/layout";
import { drawOneLine } from "../diagram/pdf";
import type { ProjectRecord } from "../schemas/project-record";

export type OneLineDrawer = (
  page: PDFPage,
  box: { x: number; y: number; width: number; height: number },
  fonts: { regular: PDFFont; bold: PDFFont },
) => void;

/** Lays the one-line diagram out once (async, ELK) so the sheet writer can draw it synchronously. */
export async function prepareOneLine(record: ProjectRecord, aspectRatio: number, failures: DiagramFailure[] = []): Promise<OneLineDrawer> {
  const layout = await layoutOneLine(record, { aspectRatio, failures });
  return (page, box, fonts) => drawOneLine(page, layout, box, fonts);
}
