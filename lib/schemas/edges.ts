import { z } from "zod";

/**
 * The shapes route handlers accept at the edge, before a service reads the
 * meaning. A service still parses its own input with its own schema; these
 * make sure what reaches it is the right kind of thing and bounded.
 */

/** Any JSON object: a record, a library item. Arrays and bare values are refused here. */
export const jsonObjectSchema = z.record(z.string(), z.unknown(), { error: "must be a JSON object" });

/** The version an edit was made from, when the client sends one. */
const optionalVersion = z.number({ error: "must be the version number you opened" }).int().optional();

export const optionalVersionSchema = z.object({ version: optionalVersion });

/** `{ version, item }`: an edit of a library item from the version it was opened at. */
export const versionedItemSchema = z.object({ version: optionalVersion, item: z.unknown() });

/** The whole project record, saved from the version it was opened at. */
export const projectSaveSchema = z.object({
  version: z.number({ error: "the version you opened is required" }).int(),
  record: z.unknown(),
});

/** A project file to import as a new project, into a jurisdiction when one is named. */
export const projectImportSchema = z.object({
  file: z.unknown(),
  jurisdictionId: z.string().min(1).max(64).optional(),
});

/** Links an attachment to an equipment tag, or unlinks it with null. */
export const attachmentLinkSchema = z.object({
  equipmentTag: z.string().max(200, { message: "must be at most 200 characters" }).nullable().optional(),
});

/** A note to the reviewers when a revision is sent; required by the service when checks fail. */
export const sendForReviewSchema = z.object({
  message: z.string().max(4000, { message: "must be at most 4000 characters" }).optional(),
});

/** A packet's fingerprint, for the public check at the permit counter. */
export const sha256BodySchema = z.object({ sha256: z.string().max(128) });

/**
 * A form's text fields by name, each optional and bounded: the shape a server
 * action accepts before the service parses the meaning. A field sent as
 * something other than text (a file, a number from a script) is refused here.
 */
export function formFieldsSchema<const K extends string>(names: readonly K[], maxChars = 10_000) {
  const field = z.string().max(maxChars, { message: `must be at most ${maxChars} characters` }).optional();
  return z.object(Object.fromEntries(names.map((n) => [n, field])) as Record<K, typeof field>);
}

/** A revision or row id passed on its own. */
export const idSchema = z.string({ error: "is required" }).min(1, { message: "is required" }).max(64, { message: "is not an id" });

/** A review decision as the review desk sends it; the review service parses the decision itself. */
export const decisionEdgeSchema = z.looseObject({
  revisionId: idSchema,
  decision: z.string().max(20),
  certificatePassword: z.string().max(200).optional(),
});

export const signPacketEdgeSchema = z.object({ revisionId: idSchema, certificatePassword: z.string().max(200, { message: "must be at most 200 characters" }) });

/** A sheet template edit: templates are short text; the bound keeps one save from filling the database. */
export const TEMPLATE_MAX_CHARS = 100_000;
export const templatePreviewSchema = z.object({
  jurisdictionId: idSchema,
  name: z.string().min(1).max(64),
  source: z.string().max(TEMPLATE_MAX_CHARS, { message: `must be at most ${TEMPLATE_MAX_CHARS} characters` }),
});
export const templateSaveSchema = templatePreviewSchema.extend({ version: z.number().int().min(1) });

const installItem = {
  revisionId: idSchema,
  itemKind: z.enum(["label", "equipment", "clearance"]),
  itemId: z.string().min(1).max(120),
};
export const confirmItemSchema = z.object({ ...installItem, confirmed: z.enum(["true", "false"]) });
export const attachPhotoSchema = z.object({ ...installItem, photoAttachmentId: idSchema });

export const signInFormSchema = z.object({
  email: z.string().max(254, { message: "must be at most 254 characters" }),
  password: z.string().max(1000, { message: "is too long" }),
  next: z.string().max(2000),
});

/** Saves a project's design as a template: a new one, or in place of `replaceTemplateId`. */
export const projectTemplateFromProjectSchema = z.object({
  projectId: z.string({ error: "the project to save from is required" }).min(1).max(64),
  name: z.unknown().optional(),
  description: z.unknown().optional(),
  replaceTemplateId: z.string().max(64).optional(),
  expectedVersion: z.number().int().optional(),
});

export const projectTemplateRenameSchema = z.object({
  version: z.number({ error: "the version you opened is required" }).int(),
  name: z.unknown(),
  description: z.unknown().optional(),
});
