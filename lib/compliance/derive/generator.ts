/** How a generator is installed, from the record or, when not stated, from its listing. */
import type { Trace, EquipmentOf, Indexed } from "../context";

export type Generator = EquipmentOf<"generator">;

/**
 * Portable or stationary: the designer's statement, else the listing (UL 2201 covers portable engine-generator
 * assemblies, UL 2200 stationary ones; from memory). Undefined when neither tells (named in the trace).
 */
export function generatorInstallation(g: Indexed<Generator>, t: Trace): "portable" | "stationary" | undefined {
  const given = t.read(`${g.path}.installation`, `Installation of ${g.item.tag}`, g.item.installation);
  if (given !== undefined) return given;
  t.read(`${g.path}.listing`, `Listing of ${g.item.tag}`, g.item.listing || undefined);
  if (/\b2201\b/.test(g.item.listing)) return "portable";
  if (/\b2200\b/.test(g.item.listing)) return "stationary";
  t.need(`${g.path}.installation`, `Installation of ${g.item.tag}`, undefined);
  return undefined;
}
