import { z } from "zod";

/**
 * What a reviewer sends and keeps: the decision on a packet revision with its
 * notes, and their own licence record. Shared by the review page's forms, the
 * server actions and the services; imports zod only.
 */

export const REVIEW_DECISIONS = ["returned", "approved"] as const;
export type ReviewDecision = (typeof REVIEW_DECISIONS)[number];

export const NOTE_TARGET_KINDS = ["check", "sheet", "general"] as const;
export type NoteTargetKind = (typeof NOTE_TARGET_KINDS)[number];

/** Long enough for a paragraph of reasons with code references; a packet review is read, not a thesis. */
export const NOTE_MAX_CHARS = 4000;
export const GENERAL_NOTES_MAX_CHARS = 8000;
/** Every check result and every sheet of a large packet, with room to spare. */
export const NOTES_MAX_COUNT = 400;

export const reviewNoteInputSchema = z.object({
  targetKind: z.enum(NOTE_TARGET_KINDS, { error: `must be one of ${NOTE_TARGET_KINDS.join(", ")}` }),
  /** A check result id ("max-pv-voltage:PV-1") or a sheet code ("E-003"); empty for a general note. */
  targetId: z.string().trim().max(160, { message: "must be at most 160 characters" }).default(""),
  text: z
    .string({ error: "is required" })
    .trim()
    .min(1, { message: "is empty" })
    .max(NOTE_MAX_CHARS, { message: `must be at most ${NOTE_MAX_CHARS} characters` }),
});
export type ReviewNoteInput = z.infer<typeof reviewNoteInputSchema>;

/**
 * What the reviewer decides on each attest item (a point a person confirms,
 * which the checks cannot): accepted, with a note saying on what basis, or
 * returned to the designer. An approval needs every attest item accepted.
 */
export const ATTEST_DISPOSITIONS = ["accepted", "returned"] as const;
export type AttestDisposition = (typeof ATTEST_DISPOSITIONS)[number];

export const dispositionInputSchema = z
  .object({
    resultId: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(160),
    disposition: z.enum(ATTEST_DISPOSITIONS, { error: "must be accepted or returned" }),
    note: z.string().trim().max(NOTE_MAX_CHARS, { message: `must be at most ${NOTE_MAX_CHARS} characters` }).default(""),
  })
  .superRefine((d, ctx) => {
    if (d.disposition === "accepted" && !d.note) ctx.addIssue({ code: "custom", path: ["note"], message: "is required: say on what basis the item is accepted" });
  });
export type DispositionInput = z.infer<typeof dispositionInputSchema>;

export const reviewDecisionSchema = z.object({
  revisionId: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(64),
  decision: z.enum(REVIEW_DECISIONS, { error: "must be returned or approved" }),
  generalNotes: z
    .string()
    .trim()
    .max(GENERAL_NOTES_MAX_CHARS, { message: `must be at most ${GENERAL_NOTES_MAX_CHARS} characters` })
    .default(""),
  notes: z.array(reviewNoteInputSchema).max(NOTES_MAX_COUNT, { message: `must be at most ${NOTES_MAX_COUNT} notes` }).default([]),
  dispositions: z.array(dispositionInputSchema).max(NOTES_MAX_COUNT, { message: `must be at most ${NOTES_MAX_COUNT} dispositions` }).default([]),
  /** The reviewer confirms the stamp's meaning; an approval without it is refused. */
  confirmStamp: z.boolean().optional(),
});
export type ReviewDecisionInput = z.input<typeof reviewDecisionSchema>;

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True for a real calendar date written YYYY-MM-DD (2027-02-30 is not one). */
export function isCalendarDate(value: string): boolean {
  const m = ISO_DATE.exec(value);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(Date.UTC(y, mo - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d;
}

/**
 * A reviewer's professional licence as they enter it. Whether the expiry has
 * passed is the service's question (it holds the clock); the schema checks
 * the form of each field.
 */
export const licenceInputSchema = z.object({
  licenceNumber: z
    .string({ error: "is required" })
    .trim()
    .min(2, { message: "is required (at least 2 characters)" })
    .max(40, { message: "must be at most 40 characters" })
    .regex(/^[A-Za-z0-9][A-Za-z0-9 .\-/]*$/, { message: "may hold letters, digits, spaces and . - / only, starting with a letter or digit" }),
  region: z
    .string({ error: "is required" })
    .trim()
    .min(2, { message: "is required: the state or province that issued the licence" })
    .max(80, { message: "must be at most 80 characters" }),
  discipline: z
    .string({ error: "is required" })
    .trim()
    .min(2, { message: "is required, e.g. Electrical" })
    .max(60, { message: "must be at most 60 characters" }),
  expiresOn: z
    .string({ error: "is required" })
    .trim()
    .refine(isCalendarDate, { message: "must be a date written YYYY-MM-DD" }),
  /** The version the form read; absent when the reviewer records a licence for the first time. */
  version: z.coerce.number().int().min(1).optional(),
});
export type LicenceInput = z.input<typeof licenceInputSchema>;
