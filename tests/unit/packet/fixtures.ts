import { deflateSync } from "node:zlib";
import { PDFDocument, StandardFonts } from "pdf-lib";
import type { CheckResult, CheckRun, CheckStatus } from "@/lib/compliance/types";
import { CHECK_STATUSES } from "@/lib/compliance/types";
import type { LabelRequirement } from "@/lib/labels/types";
import type { PacketInput } from "@/lib/packet/types";
import { projectRecordSchema, type ProjectRecord } from "@/lib/schemas/project-record";

/**
 * A small invented stand-alone cabin system and hand-made check results, so
 * the packet can be rendered without the engine. Figures worked by hand from
 * the ratings below; the engine's own tests hold the reference values.
 */
export const fixtureRecord: ProjectRecord = projectRecordSchema.parse({
  name: "Quillon Creek Cabin",
  client: "Marguerite Okonkwo-Hale",
  systemKind: "stand-alone",
  site: {
    address: "41 Larchmere Lane, Quillon Creek",
    occupancy: "one-two-family-dwelling",
    mounting: "ground",
    designLowTempC: -20,
    designLowTempSource: "Invented weather station, extreme minimum (demo data)",
    designHighTempC: 34,
    designHighTempSource: "Invented weather station, 2 % design dry bulb (demo data)",
    sunHoursPerDay: 3.5,
    batteryLocation: "utility-closet",
    batteryLocationNote: "Mechanical closet off the mud room, north wall",
    batterySpacingIn: 36,
    hasSmokeOrHeatDetection: true,
  },
  jurisdiction: { name: "Quillon County Building Division", necEdition: "2020", residentialCode: "IRC-2021" },
  daysOfAutonomy: 2,
  equipment: [
    {
      kind: "pv-module", tag: "PV-MOD", manufacturer: "Brightfen", model: "BF-400M", quantity: 6,
      pmaxW: 400, vocV: 49.5, iscA: 10.2, vmpV: 41.7, impA: 9.6, tempCoeffVocPctPerC: -0.28,
      maxSeriesFuseA: 20, maxSystemVoltageV: 1000, listing: "UL 61730",
    },
    {
      kind: "charge-controller", tag: "CC-1", manufacturer: "Orrin Power", model: "MX-150/60", controllerType: "mppt",
      maxPvInputVoltageV: 150, maxPvInputCurrentA: 50, ratedOutputCurrentA: 60, batteryVoltagesV: [12, 24, 48],
      listing: "UL 1741",
    },
    {
      kind: "inverter-charger", tag: "INV-1", manufacturer: "Orrin Power", model: "IC-4048", continuousW: 4000,
      surgeW: 8000, nominalBatteryVoltageV: 48, minBatteryVoltageV: 44, acOutput: "120/240", acOutputVoltageV: 240,
      maxAcOutputCurrentA: 16.7, efficiencyPct: 93, idleW: 25, listedMode: "stand-alone", listing: "UL 1741",
    },
    {
      kind: "battery", tag: "BAT-1", manufacturer: "Stillwater Cells", model: "SW-51100", quantity: 2,
      chemistry: "lfp", nominalVoltageV: 51.2, capacityAh: 100, capacityKWh: 5.12, maxContinuousDischargeA: 100,
      shortCircuitCurrentA: 6000, usableDodPct: 90, maxConnectionsPerTerminal: 3, listing: "UL 9540, UL 1973",
    },
    {
      kind: "disconnect", tag: "DS-1", manufacturer: "Kestrel", model: "KD-60", ratingA: 60, voltageRatingV: 600,
      currentType: "dc",
    },
    {
      kind: "fuse", tag: "F-1", manufacturer: "Kestrel", model: "KF-150", ratingA: 150, voltageRatingV: 125,
      currentType: "dc", interruptingRatingA: 20000, distanceFromBatteryFt: 2,
    },
    {
      kind: "breaker", tag: "CB-1", manufacturer: "Kestrel", model: "KB-40DC", ratingA: 40, voltageRatingV: 150,
      currentType: "dc", interruptingRatingA: 10000,
    },
    { kind: "ac-panel", tag: "LC-1", manufacturer: "Kestrel", model: "KP-100", busRatingA: 100, mainBreakerA: 60, voltage: "120/240" },
  ],
  arrays: [{ tag: "PV-1", moduleTag: "PV-MOD", modulesInSeries: 3, stringsInParallel: 2, feedsTag: "CC-1" }],
  circuits: [
    {
      tag: "C1", fromTag: "PV-MOD", toTag: "DS-1", kind: "pv-output", arrayTag: "PV-1", material: "cu", size: "10",
      insulation: "PV wire", insulationTempRatingC: 90, currentCarryingConductors: 2, racewayType: "PVC Sch 80",
      racewaySize: "3/4", lengthFt: 80, ambientTempC: 34, terminalTempRatingC: 75, disconnectTags: ["DS-1"], egcSize: "10",
    },
    {
      tag: "C2", fromTag: "DS-1", toTag: "CC-1", kind: "pv-output", arrayTag: "PV-1", material: "cu", size: "10",
      insulation: "THWN-2", insulationTempRatingC: 90, currentCarryingConductors: 2, racewayType: "EMT",
      racewaySize: "3/4", lengthFt: 6, terminalTempRatingC: 75, ocpdTag: "CB-1", egcSize: "10",
    },
    {
      tag: "C3", fromTag: "BAT-1", toTag: "INV-1", kind: "battery", material: "cu", size: "2/0",
      insulation: "THHN", insulationTempRatingC: 90, currentCarryingConductors: 2, racewayType: "EMT",
      racewaySize: "1-1/4", lengthFt: 8, terminalTempRatingC: 75, ocpdTag: "F-1", egcSize: "6",
    },
    {
      tag: "C4", fromTag: "INV-1", toTag: "LC-1", kind: "inverter-ac-output", material: "cu", size: "10",
      insulation: "THHN", insulationTempRatingC: 90, currentCarryingConductors: 3, racewayType: "EMT",
      racewaySize: "3/4", lengthFt: 15, terminalTempRatingC: 75, egcSize: "10",
    },
  ],
  loads: [
    { name: "Refrigerator", watts: 150, quantity: 1, hoursPerDay: 10, surgeW: 900 },
    { name: "Well pump", watts: 1000, quantity: 1, hoursPerDay: 1, surgeW: 3000, voltageV: 240 },
    { name: "LED lighting", watts: 10, quantity: 8, hoursPerDay: 5 },
  ],
});

function result(partial: Partial<CheckResult> & Pick<CheckResult, "checkId" | "title" | "status">): CheckResult {
  return {
    id: partial.subject ? `${partial.checkId}:${partial.subject}` : partial.checkId,
    message: "",
    values: [],
    formula: "",
    inputs: [],
    missing: [],
    codeRefs: ["NEC 2020 110.3(B)"],
    ...partial,
  };
}

/** Figures worked by hand from the fixture ratings (Voc 49.5 V × 3 in series; Isc 10.2 A × 2 strings). */
export const MAX_PV_VOLTAGE_V = 167.2; // 148.5 V × (1 + 0.0028/°C × 45 °C) = 167.21 V, NEC 2020 690.7(A)(1)
export const PV_OUTPUT_AMPACITY_A = 36.4; // 10 AWG Cu 90 °C 40 A (NEC 2020 Table 310.16) × 0.91 at 34 °C (Table 310.15(B)(1))
export const PV_OUTPUT_CURRENT_A = 25.5; // 10.2 A × 2 strings × 1.25, NEC 2020 690.8(A)(1)
export const PV_OUTPUT_REQUIRED_A = 31.88; // 25.5 A × 1.25, NEC 2020 690.8(B)(1)
export const PV_OUTPUT_ALLOWED_A = 35; // 36.4 A limited by the 75 °C terminal column, NEC 2020 110.14(C)(1)

export const fixtureResults: CheckResult[] = [
  result({
    checkId: "max-pv-voltage",
    title: "Maximum PV system voltage",
    subject: "PV-1",
    status: "pass",
    message: "167.2 V at -20 °C is within the 600 V limit for a one- and two-family dwelling.",
    formula: "Voc × modules in series × (1 + |coefficient| × (25 °C − design low))",
    inputs: [
      { path: "equipment.0.vocV", label: "Module Voc", value: 49.5, unit: "V" },
      { path: "arrays.0.modulesInSeries", label: "Modules in series", value: 3, unit: "" },
      { path: "equipment.0.tempCoeffVocPctPerC", label: "Voc temperature coefficient", value: -0.28, unit: "%/°C" },
      { path: "site.designLowTempC", label: "Design low temperature", value: -20, unit: "°C" },
    ],
    values: [
      { key: "correctionFactor", label: "Correction factor", value: 1.126, unit: "" },
      { key: "maxVoltageV", label: "Maximum PV system voltage", value: MAX_PV_VOLTAGE_V, unit: "V" },
      { key: "limitV", label: "Lowest device rating", value: 600, unit: "V" },
    ],
    codeRefs: ["NEC 2020 690.7(A)(1)", "NEC 2020 690.7(C)"],
  }),
  result({
    checkId: "max-pv-voltage",
    title: "Maximum PV voltage against the controller input",
    subject: "CC-1",
    status: "fail",
    message: "167.2 V exceeds the controller's 150 V maximum PV input.",
    reason: "String voltage at the design low temperature is above the controller rating.",
    formula: "maximum PV voltage ≤ controller maximum PV input voltage",
    inputs: [{ path: "equipment.1.maxPvInputVoltageV", label: "Controller max PV input", value: 150, unit: "V" }],
    values: [
      { key: "maxVoltageV", label: "Maximum PV system voltage", value: MAX_PV_VOLTAGE_V, unit: "V" },
      { key: "limitV", label: "Controller maximum PV input", value: 150, unit: "V" },
    ],
    codeRefs: ["NEC 2020 690.7(A)", "NEC 2020 110.3(B)"],
  }),
  result({
    checkId: "conductor-ampacity",
    title: "Conductor ampacity with conditions of use",
    subject: "C1",
    status: "pass",
    message: "10 AWG Cu allows 35 A (75 °C terminals); 31.88 A required.",
    formula: "Table 310.16 ampacity × ambient correction ≥ max(1.25 × continuous, continuous ÷ factors)",
    inputs: [
      { path: "circuits.0.size", label: "Conductor size", value: "10 AWG", unit: "" },
      { path: "circuits.0.ambientTempC", label: "Ambient", value: 34, unit: "°C" },
    ],
    values: [
      { key: "currentA", label: "Circuit current", value: PV_OUTPUT_CURRENT_A, unit: "A" },
      { key: "requiredUnadjustedA", label: "125 % of the current (no adjustment)", value: PV_OUTPUT_REQUIRED_A, unit: "A" },
      { key: "tableAtInsulationA", label: "Table ampacity at 90 °C", value: 40, unit: "A" },
      { key: "correction", label: "Ambient correction at 90 °C", value: 0.91, unit: "" },
      { key: "correctedA", label: "Ampacity under conditions of use", value: PV_OUTPUT_AMPACITY_A, unit: "A" },
      { key: "tableAtTerminalA", label: "Table ampacity at the 75 °C terminal column", value: 35, unit: "A" },
      { key: "allowedA", label: "Allowed ampacity", value: PV_OUTPUT_ALLOWED_A, unit: "A" },
    ],
    codeRefs: ["NEC 2020 690.8(B)", "NEC 2020 310.15(B)(1)", "NEC 2020 Table 310.16", "NEC 2020 110.14(C)"],
  }),
  result({
    checkId: "voltage-drop",
    title: "Voltage drop",
    subject: "C1",
    status: "warning",
    message: "3.4 % on C1 exceeds the 3 % recommendation.",
    formula: "2 × length × current × R ÷ V",
    values: [{ key: "dropPct", label: "Voltage drop", value: 3.4, unit: "%" }],
    codeRefs: ["NEC 2020 210.19(A) Informational Note 4"],
  }),
  result({
    checkId: "rapid-shutdown",
    title: "Rapid shutdown",
    status: "not-applicable",
    message: "Ground-mounted array; no PV circuits on or in a building.",
    reason: "Ground mount",
    codeRefs: ["NEC 2020 690.12"],
  }),
  result({
    checkId: "storage-siting",
    title: "Energy storage siting",
    subject: "BAT-1",
    status: "attest",
    message: "Confirm 3 ft spacing between units on site.",
    values: [{ key: "aggregateKWh", label: "Aggregate energy", value: 10.24, unit: "kWh" }],
    codeRefs: ["IRC 2021 R328.4", "NFPA 855 15.5"],
  }),
  result({
    checkId: "ocpd-rating",
    title: "Overcurrent protection",
    subject: "C4",
    status: "needs-input",
    message: "No overcurrent device named for C4.",
    missing: ["circuits.3.ocpdTag"],
    codeRefs: ["NEC 2020 240.4"],
  }),
];

export function countStatuses(results: CheckResult[]): Record<CheckStatus, number> {
  const counts = Object.fromEntries(CHECK_STATUSES.map((s) => [s, 0])) as Record<CheckStatus, number>;
  for (const r of results) counts[r.status] += 1;
  return counts;
}

export const fixtureRun: CheckRun = { edition: "2020", results: fixtureResults, counts: countStatuses(fixtureResults) };

export const fixtureLabels: LabelRequirement[] = [
  {
    id: "pv-dc-disconnect",
    codeRef: "NEC 2020 690.53",
    signalWord: "WARNING",
    title: "PHOTOVOLTAIC SYSTEM DC DISCONNECT",
    lines: ["MAXIMUM VOLTAGE: 167.2 V", "MAXIMUM CIRCUIT CURRENT: 25.5 A"],
    location: "On the PV disconnect DS-1",
    equipmentTag: "DS-1",
  },
  {
    id: "line-load-energized",
    codeRef: "NEC 2020 690.13(B)",
    signalWord: "WARNING",
    title: "ELECTRIC SHOCK HAZARD",
    lines: ["TERMINALS ON THE LINE AND LOAD SIDES", "MAY BE ENERGIZED IN THE OPEN POSITION"],
    location: "On DS-1",
    equipmentTag: "DS-1",
  },
  {
    id: "stand-alone-single-supply",
    codeRef: "NEC 2020 710.15(C)",
    signalWord: "CAUTION",
    title: "SINGLE 120-VOLT SUPPLY",
    lines: ["DO NOT CONNECT MULTIWIRE BRANCH CIRCUITS"],
    location: "At the distribution panel LC-1",
    equipmentTag: "LC-1",
  },
  {
    id: "ess-disconnect",
    codeRef: "NEC 2020 706.15(C)",
    signalWord: "DANGER",
    title: "ENERGY STORAGE SYSTEM DISCONNECT",
    lines: ["NOMINAL VOLTAGE: 51.2 V DC", "AVAILABLE FAULT CURRENT: 6000 A", "ARC FLASH: SEE EQUIPMENT"],
    location: "At the battery fuse F-1",
    equipmentTag: "F-1",
  },
  {
    id: "stand-alone-notice",
    codeRef: "NEC 2020 710.10",
    signalWord: "NOTICE",
    title: "STAND-ALONE POWER SYSTEM",
    lines: ["POWER SOURCES: PV ARRAY, BATTERY BANK", "DISCONNECTS LOCATED IN MECHANICAL CLOSET"],
    location: "Building exterior at the service location",
  },
];

/** A small PDF of `pages` pages, each saying which datasheet and page it is. */
export async function makeDatasheetPdf(title: string, pages: number): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let i = 1; i <= pages; i += 1) {
    const page = doc.addPage([612, 792]);
    page.drawText(`${title} datasheet page ${i}`, { x: 72, y: 700, size: 18, font });
  }
  return doc.save();
}

export function fixtureInput(overrides: Partial<PacketInput> = {}): PacketInput {
  return {
    record: fixtureRecord,
    run: fixtureRun,
    labels: fixtureLabels,
    revision: {
      number: 2,
      createdAt: "2026-11-30T17:45:00.000Z",
      preparedBy: "Tobiah Venn",
      organisation: "Larkspur Solar Design Co.",
    },
    datasheets: [],
    ...overrides,
  };
}

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k += 1) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

/** A solid-colour RGB PNG (a stand-in for a scanned stamp or a site photo). */
export function makePng(width: number, height: number, rgbColour: [number, number, number]): Uint8Array {
  const raw = Buffer.alloc((width * 3 + 1) * height);
  for (let y = 0; y < height; y += 1) {
    const row = y * (width * 3 + 1);
    for (let x = 0; x < width; x += 1) raw.set(rgbColour, row + 1 + x * 3);
  }
  const chunk = (type: string, data: Uint8Array) => {
    const body = Buffer.concat([Buffer.from(type, "ascii"), Buffer.from(data)]);
    const out = Buffer.alloc(8 + data.length + 4);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc32(body), 8 + data.length);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8;
  ihdr[9] = 2;
  return new Uint8Array(
    Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      chunk("IHDR", ihdr),
      chunk("IDAT", deflateSync(raw)),
      chunk("IEND", new Uint8Array()),
    ]),
  );
}
