import { z } from "zod";

/**
 * Field builders shared by every schema. Each refusal names the allowed range
 * and unit so a form, a route handler or the command line can show it as is.
 */
export function numberIn(min: number, max: number, unit: string) {
  const range = `between ${min} and ${max}${unit ? " " + unit : ""}`;
  // zod 4 numbers refuse NaN and ±Infinity; min/max (not a refinement) so the JSON Schema carries the range.
  return z
    .number({ error: `must be a number ${range}` })
    .min(min, { message: `must be ${range}` })
    .max(max, { message: `must be ${range}` });
}

export function integerIn(min: number, max: number, unit = "") {
  const range = `a whole number between ${min} and ${max}${unit ? " " + unit : ""}`;
  return z
    .number({ error: `must be ${range}` })
    .int({ message: `must be ${range}` })
    .min(min, { message: `must be ${range}` })
    .max(max, { message: `must be ${range}` });
}

export function text(max = 200) {
  return z.string().trim().max(max, { message: `must be at most ${max} characters` });
}

export function requiredText(max = 200) {
  return z
    .string({ error: "is required" })
    .trim()
    .min(1, { message: "is required" })
    .max(max, { message: `must be at most ${max} characters` });
}

/** Equipment and circuit tags: CC-1, INV-1, BAT-1, PV-1 … */
export const tagSchema = z
  .string({ error: "is required" })
  .trim()
  .min(1, { message: "is required" })
  .max(24, { message: "must be at most 24 characters" })
  .regex(/^[A-Za-z0-9][A-Za-z0-9._\-/]*$/, {
    message: "may hold letters, digits and . _ - / only, starting with a letter or digit",
  });

/** Formats zod issues as `path: message` lines, the form every boundary reports. */
export function formatIssues(error: z.ZodError): { path: string; message: string }[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join(".") || "(record)",
    message: issue.message,
  }));
}
