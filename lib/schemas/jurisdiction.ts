import { z } from "zod";
import { NEC_EDITIONS, RESIDENTIAL_CODES } from "./project-record";
import { SUBMISSION_METHODS } from "./submission";

export const REQUIRED_DOCUMENT_IDS = ["equipment-datasheets", "storage-listing", "site-plan", "structural-letter"] as const;
export const JURISDICTION_NOTE_MAX_CHARS = 2000;

const text = (max: number) => z.string().trim().max(max, { message: `must be at most ${max} characters` });
const optionalNumber = (min: number, max: number, unit: string, integer = false) =>
  z.preprocess(
    (v) => (v === "" || v === null || v === undefined ? null : typeof v === "string" ? Number(v) : v),
    (integer ? z.number({ error: `must be a whole number of ${unit}` }).int({ message: `must be a whole number of ${unit}` }) : z.number({ error: `must be a number of ${unit}` }))
      .min(min, { message: `must be between ${min} and ${max} ${unit}` })
      .max(max, { message: `must be between ${min} and ${max} ${unit}` })
      .nullable(),
  );

/** The jurisdiction record as the office edits it; empty optional figures mean "the code's default applies". */
export const jurisdictionEditSchema = z.object({
  name: text(200).min(1, { message: "is required" }),
  region: text(120),
  necEdition: z.enum(NEC_EDITIONS, { error: `must be one of ${NEC_EDITIONS.join(", ")}` }),
  residentialCode: z.enum(RESIDENTIAL_CODES, { error: `must be one of ${RESIDENTIAL_CODES.join(", ")}` }),
  amendments: text(4000),
  /** A stricter local limit; 3 % applies when empty (common practice). */
  voltageDropLimitPct: optionalNumber(0.5, 10, "%"),
  storageAggregateLimitKWh: optionalNumber(0, 10000, "kWh"),
  submissionMethod: z.enum(SUBMISSION_METHODS, { error: "must be portal, email or counter" }),
  contact: z.object({
    name: text(200),
    email: z.union([z.literal(""), z.email({ message: "must be an e-mail address" }).max(200)]),
    phone: text(40),
    portalUrl: z.union([z.literal(""), z.url({ protocol: /^https?$/, message: "must be a web address starting with http:// or https://" }).max(300)]),
    address: text(300),
  }),
  /** Calendar days the AHJ usually takes; the office queue flags a submission waiting longer. */
  typicalReviewDays: optionalNumber(1, 365, "days", true),
  feeNotes: text(2000),
  requiredDocuments: z.array(z.enum(REQUIRED_DOCUMENT_IDS, { error: "is not a document the packet knows" })).max(REQUIRED_DOCUMENT_IDS.length),
  labelRules: z.object({
    material: text(120),
    reflective: z.boolean(),
    minLetterHeightIn: optionalNumber(0.1, 2, "in"),
    colours: text(120),
  }),
  version: z.coerce.number().int().min(1),
});
export type JurisdictionEditInput = z.input<typeof jurisdictionEditSchema>;
export type JurisdictionEdit = z.output<typeof jurisdictionEditSchema>;

export const jurisdictionNoteSchema = z.object({
  jurisdictionId: z.string().trim().min(1).max(64),
  text: text(JURISDICTION_NOTE_MAX_CHARS).min(5, { message: "is required: what the AHJ expects, in a sentence" }),
  /** The correction this note learns from, when promoted from one. */
  correctionId: z.preprocess((v) => (v === "" ? undefined : v), z.string().trim().max(64).optional()),
});
