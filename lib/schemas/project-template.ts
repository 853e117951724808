import { z } from "zod";
import { requiredText, text } from "./fields";
import { projectRecordObjectSchema, projectRecordSchema } from "./project-record";

/** The part of a project record a template keeps: everything but the site, the names and the documents. */
export const templateDesignSchema = projectRecordObjectSchema.pick({
  systemKind: true,
  daysOfAutonomy: true,
  rapidShutdownMethod: true,
  rapidShutdownInsideBoundary: true,
  grounding: true,
  equipment: true,
  arrays: true,
  circuits: true,
  loads: true,
});
export type TemplateDesign = z.output<typeof templateDesignSchema>;

export const templateNameSchema = z.object({
  name: requiredText(120),
  description: text(300).default(""),
});

/** A stand-in site and jurisdiction, so a template's references are checked by the same rules as a project's. */
const PLACEHOLDER = {
  name: "template",
  site: { occupancy: "one-two-family-dwelling", mounting: "ground" },
  jurisdiction: { name: "template", necEdition: "2023" },
} as const;

/**
 * Validates a design with the project record's own reference rules (tags
 * unique, circuits end at equipment that exists, an OCPD is a fuse or a
 * breaker), so a project made from it always opens.
 */
export function parseTemplateDesign(input: unknown) {
  const design = templateDesignSchema.safeParse(input);
  if (!design.success) return design;
  const whole = projectRecordSchema.safeParse({ ...PLACEHOLDER, ...design.data });
  if (!whole.success) return whole;
  return design;
}

/** The design part of a project record. */
export function designOf(record: z.output<typeof projectRecordObjectSchema>): TemplateDesign {
  return {
    systemKind: record.systemKind,
    daysOfAutonomy: record.daysOfAutonomy,
    rapidShutdownMethod: record.rapidShutdownMethod,
    rapidShutdownInsideBoundary: record.rapidShutdownInsideBoundary,
    grounding: record.grounding,
    equipment: record.equipment,
    arrays: record.arrays,
    circuits: record.circuits,
    loads: record.loads,
  };
}
