import { z } from "zod";

/** One plan-review comment as the AHJ wrote it, with its code citation and sheet where the letter gives them. */
export const CORRECTION_COMMENT_MAX_CHARS = 2000;
export const CORRECTION_RESPONSE_MIN_CHARS = 5;
/** A plan-review letter with more comments than this is entered in two rounds; no real letter comes near it. */
export const CORRECTIONS_MAX_ITEMS = 60;

export const correctionItemSchema = z.object({
  comment: z
    .string({ error: "is required" })
    .trim()
    .min(1, { message: "is required: the AHJ's comment" })
    .max(CORRECTION_COMMENT_MAX_CHARS, { message: `must be at most ${CORRECTION_COMMENT_MAX_CHARS} characters` }),
  citation: z.string().trim().max(120, { message: "must be at most 120 characters" }).optional().default(""),
  sheet: z.string().trim().max(40, { message: "must be at most 40 characters" }).optional().default(""),
});
export type CorrectionItemInput = z.input<typeof correctionItemSchema>;
export type CorrectionItem = z.output<typeof correctionItemSchema>;

/** The list as a form sends it (a JSON string) or as a caller passes it (an array). */
export const correctionListSchema = z.preprocess(
  (v) => {
    if (typeof v !== "string") return v;
    if (v.trim() === "") return undefined;
    try {
      return JSON.parse(v);
    } catch {
      return v;
    }
  },
  z
    .array(correctionItemSchema, { error: "must be a list of comments" })
    .max(CORRECTIONS_MAX_ITEMS, { message: `must hold at most ${CORRECTIONS_MAX_ITEMS} comments; enter a longer letter in two rounds` })
    .optional(),
);

const id = z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(64);

export const resolveCorrectionSchema = z.object({
  itemId: id,
  response: z
    .string({ error: "is required" })
    .trim()
    .min(CORRECTION_RESPONSE_MIN_CHARS, { message: "is required: say what was changed, and where" })
    .max(CORRECTION_COMMENT_MAX_CHARS, { message: `must be at most ${CORRECTION_COMMENT_MAX_CHARS} characters` }),
  version: z.coerce.number().int().min(1).optional(),
});

export const reopenCorrectionSchema = z.object({ itemId: id, version: z.coerce.number().int().min(1).optional() });

export const assignCorrectionSchema = z.object({ itemId: id, assigneeId: id, version: z.coerce.number().int().min(1).optional() });

/** "1.", "1)", "(1)", "#1", "Item 1:", "Comment 1 -" at the start of a line opens a new comment. */
const ITEM_START = /^\s*(?:(?:item|comment|correction)\s+)?(?:\(\s*\d{1,3}\s*\)|#?\d{1,3}\s*[.):\-–]|[a-z]\s*[.)])\s*/i;
/** A code section as plan-review letters cite it: "NEC 690.13(B)", "CEC 2022 705.12", "690.31(G)(3)". */
const CITATION = /\b(?:(?:NEC|CEC|IFC|IRC|IBC|NFPA\s*70)\s*(?:20\d\d\s*)?)?(?:Art(?:icle)?\.?\s*)?\d{3}\.\d{1,3}(?:\s*\([A-Za-z0-9]{1,3}\))*/;
/**
 * A sheet number: "sheet E2.1", or a bare number with a plan-set prefix ("E-002", "PV-3").
 * Other tags ("C-3" is a circuit) are not sheets unless the letter says "sheet".
 */
const SHEET = /\bsheet\s+([A-Z]{1,3}-?\d{1,3}(?:\.\d{1,2})?)\b|\b((?:E|PV|EL|G|CS|SP|S|A|T)-?\d{1,3}(?:\.\d{1,2})?)\b/i;

function sheetOf(text: string): string {
  const m = SHEET.exec(text);
  return (m?.[1] ?? m?.[2] ?? "").toUpperCase();
}

/**
 * Splits a pasted plan-review letter into comments: one per numbered or
 * lettered line, continuation lines joined to the comment above. Text with no
 * numbering becomes one comment per paragraph. The citation and sheet are
 * taken from the comment's own words when it names them; the office can
 * correct both before recording.
 */
export function splitCorrections(text: string): CorrectionItem[] {
  const lines = text.replace(/\r\n?/g, "\n").split("\n");
  const numbered = lines.some((l) => ITEM_START.test(l));
  const chunks: string[] = [];
  if (numbered) {
    let current: string[] | null = null;
    for (const line of lines) {
      if (ITEM_START.test(line)) {
        if (current) chunks.push(current.join(" "));
        current = [line.replace(ITEM_START, "")];
      } else if (line.trim() !== "") {
        // Text before the first number (a letter's heading) is not a comment.
        if (current) current.push(line.trim());
      }
    }
    if (current) chunks.push(current.join(" "));
  } else {
    chunks.push(...text.split(/\n\s*\n/).map((p) => p.replace(/\s*\n\s*/g, " ")));
  }
  return chunks
    .map((c) => c.replace(/\s+/g, " ").trim())
    .filter((c) => c !== "")
    .map((comment) => ({
      comment,
      citation: CITATION.exec(comment)?.[0].trim() ?? "",
      sheet: sheetOf(comment.replace(CITATION, "")),
    }));
}

/** One correction item as the office, designer and reviewer read it: the service builds it, the list draws it. */
export interface CorrectionView {
  id: string;
  submissionId: string;
  /** The date of the letter, from its "corrections requested" event. */
  letterOn: string;
  number: number;
  comment: string;
  citation: string;
  sheet: string;
  assigneeId: string | null;
  assigneeName: string | null;
  response: string;
  resolvedByName: string | null;
  resolvedAt: string | null;
  open: boolean;
  version: number;
}
