/**
 * Conductor insulation types and wiring methods as data, so the editor offers
 * pick-lists instead of free text and the checks can tell a real type from a
 * typo, a fixed-wiring type from a flexible cord, and a metal raceway from a
 * non-metallic one.
 *
 * Insulation temperature ratings: NEC Table 310.4(A) (2020, 2023; Table
 * 310.104(A) in 2017), and UL 4703 for PV wire. Cable ampacity limits: 334.80
 * (NM-B at the 60 °C column) and 340.80 (UF at 60 °C). Flexible cords: Table
 * 400.4 and 400.12 (not a substitute for fixed wiring). The entries are from
 * memory of those tables; a reviewer should confirm an unusual type against
 * the adopted edition.
 */

import { normalizeInsulation, normalizeRaceway, type InsulationCode, type RacewayCode } from "../../schemas/wiring-codes";

export type ConductorClass = "building-wire" | "cable" | "flexible-cord" | "welding-cable";

export interface InsulationType {
  /** As printed on the conductor, e.g. "THWN-2". */
  code: InsulationCode;
  /** Temperature rating in dry locations. */
  dryRatingC: 60 | 75 | 90;
  /** Temperature rating in wet locations; absent where the type is not for wet locations. */
  wetRatingC?: 60 | 75 | 90;
  /** Column of Table 310.16 the ampacity is taken from, where the cable's own article limits it below the insulation rating. */
  ampacityColumnC?: 60 | 75 | 90;
  sunlightResistant: boolean;
  /** Whether Chapter 3 recognises it as a premises wiring method or building wire. */
  conductorClass: ConductorClass;
  label: string;
}

export const INSULATION_TYPES: readonly InsulationType[] = [
  { code: "THWN-2", dryRatingC: 90, wetRatingC: 90, sunlightResistant: false, conductorClass: "building-wire", label: "THWN-2 (90 °C wet and dry)" },
  { code: "THHN", dryRatingC: 90, sunlightResistant: false, conductorClass: "building-wire", label: "THHN (90 °C dry)" },
  { code: "THWN", dryRatingC: 75, wetRatingC: 75, sunlightResistant: false, conductorClass: "building-wire", label: "THWN (75 °C)" },
  { code: "THW", dryRatingC: 75, wetRatingC: 75, sunlightResistant: false, conductorClass: "building-wire", label: "THW (75 °C)" },
  { code: "THW-2", dryRatingC: 90, wetRatingC: 90, sunlightResistant: false, conductorClass: "building-wire", label: "THW-2 (90 °C wet and dry)" },
  { code: "THHW", dryRatingC: 90, wetRatingC: 75, sunlightResistant: false, conductorClass: "building-wire", label: "THHW (90 °C dry, 75 °C wet)" },
  { code: "XHHW", dryRatingC: 90, wetRatingC: 75, sunlightResistant: false, conductorClass: "building-wire", label: "XHHW (90 °C dry, 75 °C wet)" },
  { code: "XHHW-2", dryRatingC: 90, wetRatingC: 90, sunlightResistant: false, conductorClass: "building-wire", label: "XHHW-2 (90 °C wet and dry)" },
  { code: "RHW", dryRatingC: 75, wetRatingC: 75, sunlightResistant: false, conductorClass: "building-wire", label: "RHW (75 °C)" },
  { code: "RHW-2", dryRatingC: 90, wetRatingC: 90, sunlightResistant: false, conductorClass: "building-wire", label: "RHW-2 (90 °C wet and dry)" },
  { code: "USE-2", dryRatingC: 90, wetRatingC: 90, sunlightResistant: true, conductorClass: "building-wire", label: "USE-2 (90 °C, sunlight resistant)" },
  { code: "PV WIRE", dryRatingC: 90, wetRatingC: 90, sunlightResistant: true, conductorClass: "building-wire", label: "PV wire (90 °C wet, sunlight resistant)" },
  { code: "TW", dryRatingC: 60, wetRatingC: 60, sunlightResistant: false, conductorClass: "building-wire", label: "TW (60 °C)" },
  { code: "NM-B", dryRatingC: 90, ampacityColumnC: 60, sunlightResistant: false, conductorClass: "cable", label: "NM-B cable (ampacity at 60 °C, dry only)" },
  { code: "UF-B", dryRatingC: 60, wetRatingC: 60, ampacityColumnC: 60, sunlightResistant: false, conductorClass: "cable", label: "UF-B cable (60 °C)" },
  { code: "SOOW", dryRatingC: 90, wetRatingC: 60, sunlightResistant: false, conductorClass: "flexible-cord", label: "SOOW flexible cord" },
  { code: "SJOOW", dryRatingC: 90, wetRatingC: 60, sunlightResistant: false, conductorClass: "flexible-cord", label: "SJOOW flexible cord" },
  { code: "WELDING CABLE", dryRatingC: 90, sunlightResistant: false, conductorClass: "welding-cable", label: "Welding cable (not a premises wiring method)" },
];

/** Case- and spacing-insensitive lookup ("thwn-2", "PV Wire", "pv-wire"). */
export function insulationType(code: string | undefined): InsulationType | undefined {
  if (code === undefined) return undefined;
  const key = normalizeInsulation(code);
  if (key === "") return undefined;
  return INSULATION_TYPES.find((t) => t.code === key);
}

export interface RacewayType {
  /** Short trade name, e.g. "EMT". */
  code: RacewayCode;
  label: string;
  /** NEC article of the wiring method (same number in 2017, 2020 and 2023). */
  article: string;
  /** Metal raceway or metal-clad cable, as 690.31 asks for PV circuits inside a building. */
  metallic: boolean;
  /** A raceway whose trade size and Chapter 9 fill apply (not open wiring or direct burial). */
  isRaceway: boolean;
}

export const RACEWAY_TYPES: readonly RacewayType[] = [
  { code: "EMT", label: "EMT, electrical metallic tubing", article: "358", metallic: true, isRaceway: true },
  { code: "RMC", label: "RMC, rigid metal conduit", article: "344", metallic: true, isRaceway: true },
  { code: "IMC", label: "IMC, intermediate metal conduit", article: "342", metallic: true, isRaceway: true },
  { code: "FMC", label: "FMC, flexible metal conduit", article: "348", metallic: true, isRaceway: true },
  { code: "LFMC", label: "LFMC, liquidtight flexible metal conduit", article: "350", metallic: true, isRaceway: true },
  { code: "PVC-40", label: "PVC Schedule 40 rigid conduit", article: "352", metallic: false, isRaceway: true },
  { code: "PVC-80", label: "PVC Schedule 80 rigid conduit", article: "352", metallic: false, isRaceway: true },
  { code: "HDPE", label: "HDPE conduit (underground)", article: "353", metallic: false, isRaceway: true },
  { code: "LFNC", label: "LFNC, liquidtight flexible non-metallic conduit", article: "356", metallic: false, isRaceway: true },
  { code: "ENT", label: "ENT, electrical non-metallic tubing", article: "362", metallic: false, isRaceway: true },
  { code: "MC", label: "MC cable (metal-clad)", article: "330", metallic: true, isRaceway: false },
  // A metal tray is a support system, not a raceway: 690.31 does not count it as a metal enclosure of the conductors.
  { code: "CABLE-TRAY", label: "Cable tray", article: "392", metallic: false, isRaceway: false },
  { code: "FREE-AIR", label: "Exposed, in free air (module leads, array wiring)", article: "690.31", metallic: false, isRaceway: false },
  { code: "DIRECT-BURIAL", label: "Direct burial", article: "300.5", metallic: false, isRaceway: false },
];

export function racewayType(code: string | undefined): RacewayType | undefined {
  if (code === undefined) return undefined;
  const key = normalizeRaceway(code);
  if (key === "") return undefined;
  return RACEWAY_TYPES.find((t) => t.code === key);
}
