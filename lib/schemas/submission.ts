import { z } from "zod";
import { correctionListSchema } from "./corrections";

/**
 * What the permit office enters: a new submission of an approved revision and
 * each event that follows it. Shared by the forms, the server actions and the
 * services; imports zod only. Whether a date lies too far ahead is the
 * service's question (it holds the clock).
 */

export const SUBMISSION_METHODS = ["portal", "email", "counter"] as const;
export type SubmissionMethod = (typeof SUBMISSION_METHODS)[number];

/** Kinds of submission event; the submission_events table takes its column values from this list. */
export const EVENT_KINDS = [
  "submitted",
  "in-plan-review",
  "on-hold",
  "corrections-requested",
  "resubmitted",
  "approved",
  "permit-issued",
  "fee-paid",
  "inspection-scheduled",
  "inspection-passed",
  "inspection-failed",
  "finaled",
  "expired",
  "cancelled",
] as const;
export type EventKind = (typeof EVENT_KINDS)[number];

export const INSPECTION_KINDS = ["rough", "final", "fire-final"] as const;
export type InspectionKind = (typeof INSPECTION_KINDS)[number];

export const EVENT_LABELS: Record<EventKind, string> = {
  submitted: "Submitted",
  "in-plan-review": "In plan review",
  "on-hold": "On hold",
  "corrections-requested": "Corrections requested",
  resubmitted: "Resubmitted",
  approved: "Approved by the AHJ",
  "permit-issued": "Permit issued",
  "fee-paid": "Fee paid",
  "inspection-scheduled": "Inspection scheduled",
  "inspection-passed": "Inspection passed",
  "inspection-failed": "Inspection failed",
  finaled: "Finaled",
  expired: "Expired",
  cancelled: "Cancelled",
};

export const INSPECTION_LABELS: Record<InspectionKind, string> = { rough: "Rough", final: "Final", "fire-final": "Fire final" };

/** Kinds that carry an inspection kind. */
export const INSPECTION_EVENT_KINDS: readonly EventKind[] = ["inspection-scheduled", "inspection-passed", "inspection-failed"];

/** A scheduled inspection may lie ahead; every other event has happened. A year bounds a typo in the year field. */
export const SCHEDULE_AHEAD_MAX_DAYS = 366;
/** Permits in the demo jurisdictions run months to a few years; ten years bounds a typo (common practice). */
export const PERMIT_VALID_MAX_DAYS = 3660;
/** A residential or small commercial permit fee; a larger figure is almost certainly a typo (common practice). */
export const FEE_MAX_USD = 100_000;

export const NOTE_MAX_CHARS = 2000;

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True for a real calendar date written YYYY-MM-DD (2027-02-30 is not one). */
export function isCalendarDate(value: string): boolean {
  const m = ISO_DATE.exec(value);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(Date.UTC(y, mo - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d;
}

const dateField = z
  .string({ error: "is required" })
  .trim()
  .refine(isCalendarDate, { message: "must be a date written YYYY-MM-DD" });

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, { message: `must be at most ${max} characters` })
    .optional()
    .transform((v) => v ?? "");

export const createSubmissionSchema = z.object({
  revisionId: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(64),
  method: z.enum(SUBMISSION_METHODS, { error: "must be portal, email or counter" }),
  /** The AHJ's own number; often given only after intake, so it may be empty. */
  referenceNumber: z
    .string()
    .trim()
    .max(60, { message: "must be at most 60 characters" })
    .regex(/^[A-Za-z0-9 .\-/#]*$/, { message: "may hold letters, digits, spaces and . - / # only" })
    .optional()
    .transform((v) => v ?? ""),
  occurredOn: dateField,
  note: optionalText(NOTE_MAX_CHARS),
});
export type CreateSubmissionInput = z.input<typeof createSubmissionSchema>;

const emptyToUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

export const recordEventSchema = z
  .object({
    submissionId: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(64),
    kind: z.enum(EVENT_KINDS, { error: `must be one of ${EVENT_KINDS.join(", ")}` }),
    occurredOn: dateField,
    note: optionalText(NOTE_MAX_CHARS),
    permitNumber: z.preprocess(emptyToUndefined, z.string().trim().max(60, { message: "must be at most 60 characters" }).optional()),
    expiresOn: z.preprocess(emptyToUndefined, dateField.optional()),
    amountUsd: z.preprocess(
      (v) => (typeof v === "string" ? (v.trim() === "" ? undefined : Number(v)) : v),
      z
        .number({ error: `must be a number of dollars between 0.01 and ${FEE_MAX_USD}` })
        .min(0.01, { message: `must be between 0.01 and ${FEE_MAX_USD} dollars` })
        .max(FEE_MAX_USD, { message: `must be between 0.01 and ${FEE_MAX_USD} dollars` })
        .optional(),
    ),
    inspectionKind: z.preprocess(emptyToUndefined, z.enum(INSPECTION_KINDS, { error: "must be rough, final or fire-final" }).optional()),
    /** The approved revision sent again with a resubmission; it must differ from every revision already before the AHJ. */
    revisionId: z.preprocess(emptyToUndefined, z.string().trim().max(64).optional()),
    /** The plan-review letter's comments, with "corrections requested": each becomes an item to work. */
    corrections: correctionListSchema,
    /** Who takes the comments first: a designer or reviewer; the revision's designer when not named. */
    assigneeId: z.preprocess(emptyToUndefined, z.string().trim().max(64).optional()),
    /** The version of the submission the form read; a stale form is refused. */
    version: z.coerce.number().int().min(1).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.corrections?.length && v.kind !== "corrections-requested") ctx.addIssue({ code: "custom", path: ["corrections"], message: "go with corrections requested only" });
    if (v.kind === "permit-issued" && !v.permitNumber) ctx.addIssue({ code: "custom", path: ["permitNumber"], message: "is required when the permit is issued" });
    if (v.kind === "permit-issued" && v.expiresOn && v.expiresOn <= v.occurredOn) {
      ctx.addIssue({ code: "custom", path: ["expiresOn"], message: "must be after the date the permit was issued" });
    }
    if (v.kind === "fee-paid" && v.amountUsd === undefined) ctx.addIssue({ code: "custom", path: ["amountUsd"], message: "is required when a fee is paid" });
    if (v.kind === "resubmitted" && !v.revisionId) ctx.addIssue({ code: "custom", path: ["revisionId"], message: "is required: the approved revision sent again" });
    if (INSPECTION_EVENT_KINDS.includes(v.kind) && !v.inspectionKind) {
      ctx.addIssue({ code: "custom", path: ["inspectionKind"], message: "is required: rough, final or fire-final" });
    }
  });
export type RecordEventInput = z.input<typeof recordEventSchema>;

export const VOID_REASON_MIN_CHARS = 5;

/** Voids an event recorded in error: the void is a new entry with its reason; nothing is deleted. */
export const voidEventSchema = z.object({
  submissionId: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(64),
  eventId: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(64),
  reason: z
    .string({ error: "is required" })
    .trim()
    .min(VOID_REASON_MIN_CHARS, { message: "is required: say why the entry is wrong" })
    .max(NOTE_MAX_CHARS, { message: `must be at most ${NOTE_MAX_CHARS} characters` }),
  version: z.coerce.number().int().min(1).optional(),
});
export type VoidEventInput = z.input<typeof voidEventSchema>;
