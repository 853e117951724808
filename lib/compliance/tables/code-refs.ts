/**
 * Code references by topic and NEC edition, so every check cites the section
 * numbers of the edition the jurisdiction adopted.
 *
 * The large renumberings:
 *   - 2020 moved medium-voltage conductors to Article 311, so the 310.15(B)
 *     tables of 2017 became 310.16 and 310.15(B)(1) / 310.15(C)(1); 2023
 *     added "(1)" to the 30 °C ambient table, Table 310.15(B)(1)(1).
 *   - 2020 rewrote Article 706: the disconnect moved from 706.7 to 706.15.
 *   - 2023 moved the DC source label from 690.53 into 690.7(D) and the
 *     building rapid-shutdown label from 690.56(C) into 690.12(D), and put
 *     the standard ratings of 240.6(A) into Table 240.6(A).
 * Entries marked "from memory" are the most likely numbering without the
 * edition's text at hand; an AHJ reviewer should confirm them.
 */
import type { NecEdition } from "../../schemas/project-record";

export type CodeTopic =
  | "ampacity-table"
  | "ambient-correction"
  | "conductor-adjustment"
  | "rooftop-adder"
  | "conditions-of-use"
  | "voltage-correction-table"
  | "max-voltage"
  | "pv-circuit-current"
  | "pv-conductor-sizing"
  | "pv-ocpd"
  | "standard-ratings"
  | "small-conductor"
  | "terminal-rating"
  | "dc-resistance"
  | "egc-table"
  | "pv-egc"
  | "dc-gec"
  | "pv-disconnect"
  | "pv-equipment-disconnect"
  | "ess-disconnect"
  | "generator-disconnect"
  | "rapid-shutdown"
  | "rapid-shutdown-inside-boundary"
  | "rapid-shutdown-pv-only-building"
  | "ground-mount-voltage"
  | "rapid-shutdown-label"
  | "dc-source-label"
  | "raceway-marking"
  | "ess-label"
  | "stand-alone-supply"
  | "stand-alone-label"
  | "busbar"
  | "busbar-120-percent"
  | "busbar-sum-of-breakers"
  | "arc-flash-label"
  | "field-marking"
  | "listing-use"
  | "interrupting-rating"
  | "pv-listing"
  | "ess-listing"
  | "stand-alone-plaque"
  | "source-directory"
  | "voltage-drop"
  | "building-voltage-limit"
  | "string-fuse"
  | "ess-ocpd"
  | "pv-arc-fault"
  | "ac-gec-table"
  | "electrode-system"
  | "pv-electrode"
  | "system-bonding"
  | "objectionable-current"
  | "generator-bonding"
  | "stand-alone-output"
  | "feeder-conductors"
  | "backfed-breaker"
  | "backfed-holddown"
  | "interactive-backfed"
  | "generator-disconnect-means"
  | "building-disconnect"
  | "building-disconnect-location"
  | "pv-grounding-configuration"
  | "pv-ground-fault"
  | "pv-wiring-accessible"
  | "pv-wiring-in-building"
  | "pv-single-conductor-tray"
  | "insulation-table"
  | "wet-location-conductors"
  | "flexible-cord-uses-not-permitted"
  | "wiring-methods-recognised"
  | "cable-tray-single-conductors"
  | "fine-strand-terminals";

type ByEdition = Readonly<Record<NecEdition, string>>;

/** Same section number in all three editions. */
function same(section: string): ByEdition {
  return { "2017": section, "2020": section, "2023": section };
}

export const CODE_REFS: Readonly<Record<CodeTopic, ByEdition>> = {
  "ampacity-table": { "2017": "Table 310.15(B)(16)", "2020": "Table 310.16", "2023": "Table 310.16" },
  "ambient-correction": {
    "2017": "Table 310.15(B)(2)(a)",
    "2020": "Table 310.15(B)(1)",
    "2023": "Table 310.15(B)(1)(1)",
  },
  "conductor-adjustment": {
    "2017": "Table 310.15(B)(3)(a)",
    "2020": "Table 310.15(C)(1)",
    "2023": "Table 310.15(C)(1)",
  },
  "rooftop-adder": { "2017": "310.15(B)(3)(c)", "2020": "310.15(B)(2)", "2023": "310.15(B)(2)" },
  // 690.8(B)(2): the ampacity after correction and adjustment must carry the
  // current; the general rule for non-PV circuits is 310.15 in every edition.
  "conditions-of-use": same("690.8(B)(2)"),
  "voltage-correction-table": same("Table 690.7(A)"),
  "max-voltage": same("690.7(A)"),
  "pv-circuit-current": same("690.8(A)"),
  "pv-conductor-sizing": same("690.8(B)"),
  "pv-ocpd": same("690.9"),
  "standard-ratings": { "2017": "240.6(A)", "2020": "240.6(A)", "2023": "Table 240.6(A)" },
  "small-conductor": same("240.4(D)"),
  "terminal-rating": same("110.14(C)"),
  "dc-resistance": same("Chapter 9, Table 8"),
  "egc-table": same("Table 250.122"),
  "pv-egc": same("690.45"),
  "dc-gec": same("250.166"),
  "pv-disconnect": same("690.13"),
  "pv-equipment-disconnect": same("690.15"),
  // 2017 Article 706 was new and numbered its disconnect 706.7 (from memory).
  "ess-disconnect": { "2017": "706.7", "2020": "706.15", "2023": "706.15" },
  "generator-disconnect": same("445.18"),
  "rapid-shutdown": same("690.12"),
  // Controlled conductors inside the array boundary: listed hazard control, 80 V in 30 s, or no exposed wiring (from memory, all three editions).
  "rapid-shutdown-inside-boundary": same("690.12(B)(2)"),
  // Ground-mounted PV circuits entering a building that houses PV equipment only (from memory, all three editions).
  "rapid-shutdown-pv-only-building": same("690.12 Exception"),
  // PV DC circuits not on or in buildings: listed equipment up to 1500 V (from memory, all three editions).
  "ground-mount-voltage": same("690.7"),
  "rapid-shutdown-label": { "2017": "690.56(C)", "2020": "690.56(C)", "2023": "690.12(D)" },
  "dc-source-label": { "2017": "690.53", "2020": "690.53", "2023": "690.7(D)" },
  // 2017 690.31(G)(3)/(G)(4); 2020 regrouped DC circuits in buildings under
  // 690.31(D) (from memory for 2020 and 2023).
  "raceway-marking": { "2017": "690.31(G)(3)", "2020": "690.31(D)(2)", "2023": "690.31(D)(2)" },
  // Marking of the storage disconnect: 706.7(D) in 2017 (from memory), 706.15(C) in 2020/2023.
  "ess-label": { "2017": "706.7(D)", "2020": "706.15(C)", "2023": "706.15(C)" },
  "stand-alone-supply": same("710.15"),
  // The single 120 V supply warning.
  "stand-alone-label": same("710.15(C)"),
  // Busbar rules: 2017 705.12(B)(2)(3); 2020 restructured to 705.12(B)(3) (from memory, 2023 kept it).
  busbar: { "2017": "705.12(B)(2)(3)", "2020": "705.12(B)(3)", "2023": "705.12(B)(3)" },
  // The items within it: the 120 % rule is 2017 705.12(B)(2)(3)(b), 2020/2023 705.12(B)(3)(2); the
  // sum-of-breakers rule 2017 705.12(B)(2)(3)(c), 2020/2023 705.12(B)(3)(3) (from memory).
  "busbar-120-percent": { "2017": "705.12(B)(2)(3)(b)", "2020": "705.12(B)(3)(2)", "2023": "705.12(B)(3)(2)" },
  "busbar-sum-of-breakers": { "2017": "705.12(B)(2)(3)(c)", "2020": "705.12(B)(3)(3)", "2023": "705.12(B)(3)(3)" },
  "arc-flash-label": same("110.16"),
  "field-marking": same("110.21(B)"),
  "listing-use": same("110.3(B)"),
  "interrupting-rating": same("110.9"),
  "pv-listing": same("690.4(B)"),
  "ess-listing": same("706.5"),
  // Plaque or directory at the building showing the power sources: 2017 Article 710 has no 710.10, the
  // stand-alone plaque is 690.56(A) there (from memory).
  "stand-alone-plaque": { "2017": "690.56(A)", "2020": "710.10", "2023": "710.10" },
  "source-directory": same("705.10"),
  // The branch-circuit informational note suggesting 3 % / 5 %: a recommendation,
  // not a requirement. 2023 renumbered 210.19's notes (from memory).
  "voltage-drop": {
    "2017": "210.19(A)(1) Informational Note No. 4",
    "2020": "210.19(A)(1) Informational Note No. 4",
    "2023": "210.19(A) Informational Note",
  },
  // 600 V limit on one- and two-family dwellings.
  "building-voltage-limit": same("690.7"),
  // Series fuse rating of modules; paralleled strings feeding a fault.
  "string-fuse": same("690.9(A)"),
  // Battery overcurrent protection near the battery: 706.31 in 2020/2023, 706.21 in 2017 (from memory).
  "ess-ocpd": { "2017": "706.21", "2020": "706.31", "2023": "706.31" },
  // 690.11 DC arc-fault circuit protection: the same number since 2011 (from memory).
  "pv-arc-fault": same("690.11"),
  // GEC for AC systems by the largest supply conductor; the same table in all three editions (from memory).
  "ac-gec-table": same("Table 250.66"),
  // The grounding electrode system of a building: every electrode present bonded together (from memory).
  "electrode-system": same("250.50"),
  // Buildings supporting PV: a grounding electrode system per Part III of Article 250 (from memory, all three editions).
  "pv-electrode": same("690.47"),
  // System bonding jumper of a separately derived system: at one point, source to first disconnect (from memory).
  "system-bonding": same("250.30(A)(1)"),
  // Objectionable current on grounding paths from a second neutral-to-ground bond (from memory).
  "objectionable-current": same("250.6"),
  // Permanently installed generators' bonding (added in 2014; from memory, the same number since).
  "generator-bonding": same("250.35"),
  // Conductors between stand-alone sources and the building disconnect: the sum of the sources' output (from memory).
  "stand-alone-output": same("710.15(B)"),
  // Feeders: 125 % of the continuous load (from memory, all three editions).
  "feeder-conductors": same("215.2(A)(1)"),
  // Back-fed breakers on a stand-alone inverter's output: 690.10(E) until 2014, 710.15(E) from 2017 (from memory).
  "backfed-breaker": same("710.15(E)"),
  // Plug-in back-fed devices secured by an additional fastener (confirmed: the section's text as quoted in trade forums).
  "backfed-holddown": same("408.36(D)"),
  // Breakers back-fed from listed interactive inverters may omit the fastener: 705.12(D)(5) in 2017, 705.12(E) from 2020 (from memory).
  "interactive-backfed": { "2017": "705.12(D)(5)", "2020": "705.12(E)", "2023": "705.12(E)" },
  // A generator's disconnecting means: cord-and-plug-connected portable generators excepted (from memory).
  "generator-disconnect-means": same("445.18(A)"),
  // A building supplied by a feeder from another structure has its own disconnect; 2020 folded the location rule of
  // 225.32 into 225.31(B) (from memory).
  "building-disconnect": { "2017": "225.31", "2020": "225.31(A)", "2023": "225.31(A)" },
  "building-disconnect-location": { "2017": "225.32", "2020": "225.31(B)", "2023": "225.31(B)" },
  // 690.41(A) system grounding configurations and 690.41(B) DC ground-fault protection: rewritten in 2017 and kept
  // under the same numbers in 2020 and 2023 (2017 text from a published change analysis; 2020/2023 from memory).
  "pv-grounding-configuration": same("690.41(A)"),
  "pv-ground-fault": same("690.41(B)"),
  // PV source and output circuits over 30 V in readily accessible places: guarded, or in MC cable or raceway
  // (690.31(A) in all three editions, from memory).
  "pv-wiring-accessible": same("690.31(A)"),
  // PV DC circuits inside a building in metal raceway, MC cable or metal enclosures: 2017 690.31(G) (to the first
  // readily accessible disconnect), regrouped as 690.31(D) in 2020 with a 30 V / 8 A threshold (from memory).
  "pv-wiring-in-building": { "2017": "690.31(G)", "2020": "690.31(D)", "2023": "690.31(D)" },
  // Single-conductor PV wire and USE-2 in outdoor cable tray with close support (2020 690.31(C)(1), from memory).
  "pv-single-conductor-tray": { "2017": "392.10(B)(1)", "2020": "690.31(C)(1)", "2023": "690.31(C)(1)" },
  // Conductor insulation types and their ratings: 2017 Table 310.104(A); 2020 moved it to Table 310.4(A) (from memory).
  "insulation-table": { "2017": "Table 310.104(A)", "2020": "Table 310.4(A)", "2023": "Table 310.4(A)" },
  // Conductors in wet locations (underground, raceways exposed outdoors) are of a wet-rated type (from memory).
  "wet-location-conductors": same("310.10(C)"),
  // Flexible cords are not a substitute for fixed wiring (from memory, all three editions).
  "flexible-cord-uses-not-permitted": same("400.12"),
  // Only wiring methods the Code recognises are permitted; welding cable is for welder secondary circuits (630.42).
  "wiring-methods-recognised": same("110.8"),
  // Single conductors in cable tray: 1/0 and larger, marked for tray use, in industrial establishments (from memory).
  "cable-tray-single-conductors": same("392.10(B)(1)"),
  // Terminals for conductors finer than Class B and C stranding are identified for the class (110.14 first
  // paragraph, added in 2017; from memory).
  "fine-strand-terminals": same("110.14"),
};

export const CODE_TOPICS = Object.keys(CODE_REFS) as readonly CodeTopic[];

/** "NEC <edition> <section>", e.g. codeRef("2017", "ampacity-table") → "NEC 2017 Table 310.15(B)(16)". */
export function codeRef(edition: NecEdition, topic: CodeTopic): string {
  return `NEC ${edition} ${CODE_REFS[topic][edition]}`;
}
