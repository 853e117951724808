import { z } from "zod";

/**
 * The conductor insulation types and wiring methods a circuit may name, as
 * pick-lists rather than free text, so a typo or an invented type is refused
 * at the boundary with the list of types. The ratings and properties of each
 * code are in the engine's table (lib/compliance/tables/wiring-types.ts).
 */

/** As printed on the conductor or cable (NEC Table 310.4(A) in 2020/2023, Table 310.104(A) in 2017; UL 4703 PV wire; Table 400.4 cords). */
export const INSULATION_CODES = [
  "THWN-2",
  "THHN",
  "THWN",
  "THW",
  "THW-2",
  "THHW",
  "XHHW",
  "XHHW-2",
  "RHW",
  "RHW-2",
  "USE-2",
  "PV WIRE",
  "TW",
  "NM-B",
  "UF-B",
  "SOOW",
  "SJOOW",
  "WELDING CABLE",
] as const;
export type InsulationCode = (typeof INSULATION_CODES)[number];

/** Short trade names of the wiring methods of Chapter 3 a circuit runs in. */
export const RACEWAY_CODES = [
  "EMT",
  "RMC",
  "IMC",
  "FMC",
  "LFMC",
  "PVC-40",
  "PVC-80",
  "HDPE",
  "LFNC",
  "ENT",
  "MC",
  "CABLE-TRAY",
  "FREE-AIR",
  "DIRECT-BURIAL",
] as const;
export type RacewayCode = (typeof RACEWAY_CODES)[number];

/** Spellings designers write for the same type; the record keeps the code. */
const INSULATION_ALIASES: Readonly<Record<string, InsulationCode>> = {
  "PV-WIRE": "PV WIRE",
  PVWIRE: "PV WIRE",
  // Dual-rated building wire carries both markings; the wet-rated one is the narrower claim.
  "THHN/THWN-2": "THWN-2",
  "THHN/THWN": "THWN",
};

const RACEWAY_ALIASES: Readonly<Record<string, RacewayCode>> = {
  "PVC-SCHEDULE-40": "PVC-40",
  "PVC-SCH-40": "PVC-40",
  "PVC-SCHEDULE-80": "PVC-80",
  "PVC-SCH-80": "PVC-80",
  "MC-CABLE": "MC",
  "CABLE-TRAY": "CABLE-TRAY",
};

/** "thwn-2", "PV Wire", "pv-wire" → the code; anything else comes back trimmed and upper-cased (and is then refused). */
export function normalizeInsulation(value: string): string {
  const key = value.trim().toUpperCase().replace(/[\s_]+/g, " ");
  if (key === "") return "";
  return INSULATION_ALIASES[key] ?? INSULATION_ALIASES[key.replace(/ /g, "-")] ?? key;
}

/** "emt", "PVC schedule 80", "cable tray" → the code; anything else comes back normalised (and is then refused). */
export function normalizeRaceway(value: string): string {
  const key = value.trim().toUpperCase().replace(/[\s_]+/g, "-");
  if (key === "") return "";
  return RACEWAY_ALIASES[key] ?? key;
}

const insulationList = INSULATION_CODES.join(", ");
const racewayList = RACEWAY_CODES.join(", ");

/** Empty while not chosen; otherwise one of the insulation codes. */
export const insulationCodeSchema = z
  .string()
  .max(40, { message: "must be at most 40 characters" })
  .meta({ description: `Insulation type, one of ${insulationList} (empty while not chosen; "pv-wire", "THHN/THWN-2" are read as the code).` })
  .transform(normalizeInsulation)
  .pipe(z.enum(["", ...INSULATION_CODES], { error: `must be one of the insulation types: ${insulationList}` }));

/** Empty while not chosen; otherwise one of the wiring-method codes. */
export const racewayCodeSchema = z
  .string()
  .max(40, { message: "must be at most 40 characters" })
  .meta({ description: `Wiring method, one of ${racewayList} (empty while not chosen; "PVC schedule 80", "cable tray" are read as the code).` })
  .transform(normalizeRaceway)
  .pipe(z.enum(["", ...RACEWAY_CODES], { error: `must be one of the wiring methods: ${racewayList}` }));

/**
 * A circuit as stored before the pick-lists: a type the list does not know is cleared, so the project still opens
 * and the checks ask for the field (needs input) instead of the whole record failing to load.
 */
export function withKnownWiringCodes(circuit: Record<string, unknown>): Record<string, unknown> {
  const out = { ...circuit };
  if (typeof out.insulation === "string" && !insulationCodeSchema.safeParse(out.insulation).success) out.insulation = "";
  if (typeof out.racewayType === "string" && !racewayCodeSchema.safeParse(out.racewayType).success) out.racewayType = "";
  return out;
}
