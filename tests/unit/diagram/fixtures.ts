/**
 * Hand-built records for the one-line diagram tests. Firms, brands and
 * models are invented.
 */
import { projectRecordSchema, type ProjectRecord, type ProjectRecordInput } from "@/lib/schemas/project-record";

const site = {
  address: "14 Larkspur Lane, Hollowmere",
  occupancy: "one-two-family-dwelling",
  mounting: "ground",
  designLowTempC: -18,
  designHighTempC: 36,
} as const;

const jurisdiction = { name: "Hollowmere County", necEdition: "2023" } as const;

export function parseRecord(input: ProjectRecordInput): ProjectRecord {
  return projectRecordSchema.parse(input);
}

/** Stand-alone cabin with a generator: one array, one controller, a bus bar, a battery bank, an inverter-charger and a panel. */
export const standAloneInput: ProjectRecordInput = {
  name: "Ridgeback cabin",
  client: "M. Oduya",
  systemKind: "stand-alone-generator",
  site,
  jurisdiction,
  rapidShutdownMethod: "none",
  equipment: [
    { tag: "PV-M1", kind: "pv-module", manufacturer: "Brightfield", model: "BF-410M", pmaxW: 410, vocV: 37.4, iscA: 13.9, vmpV: 31.2, impA: 13.1, tempCoeffVocPctPerC: -0.27, maxSeriesFuseA: 25, maxSystemVoltageV: 1000 },
    { tag: "CC-1", kind: "charge-controller", manufacturer: "Northgate", model: "NG-150/60", controllerType: "mppt", maxPvInputVoltageV: 150, maxPvInputCurrentA: 60, ratedOutputCurrentA: 60, batteryVoltagesV: [12, 24, 48] },
    { tag: "DC-PV", kind: "disconnect", manufacturer: "Kestrel", model: "KD-63", ratingA: 63, voltageRatingV: 600, currentType: "dc" },
    { tag: "CB-CC", kind: "breaker", manufacturer: "Kestrel", model: "KB-80D", ratingA: 80, voltageRatingV: 150, currentType: "dc", interruptingRatingA: 10000 },
    { tag: "BUS-1", kind: "busbar", manufacturer: "Kestrel", model: "KBB-600", busRatingA: 600, voltage: "48" },
    { tag: "F-BAT", kind: "fuse", manufacturer: "Kestrel", model: "KT-250", ratingA: 250, voltageRatingV: 160, currentType: "dc", interruptingRatingA: 20000, distanceFromBatteryFt: 2 },
    { tag: "BAT-1", kind: "battery", manufacturer: "Stillwater", model: "SW-5100", chemistry: "lfp", nominalVoltageV: 51.2, capacityAh: 100, capacityKWh: 5.12, quantity: 3, listing: "UL 9540" },
    { tag: "CB-INV", kind: "breaker", manufacturer: "Kestrel", model: "KB-175D", ratingA: 175, voltageRatingV: 125, currentType: "dc", interruptingRatingA: 25000 },
    { tag: "INV-1", kind: "inverter-charger", manufacturer: "Ambergate", model: "AG-6048", continuousW: 6000, surgeW: 12000, nominalBatteryVoltageV: 48, acOutput: "120/240", listedMode: "stand-alone" },
    { tag: "GEN-1", kind: "generator", manufacturer: "Fernbrook", model: "FG-7500", ratedKW: 7.5, output: "120/240", fuel: "propane", outputBreakerA: 30 },
    { tag: "DS-GEN", kind: "disconnect", manufacturer: "Kestrel", model: "KS-30A", ratingA: 30, voltageRatingV: 240, currentType: "ac" },
    { tag: "PNL-1", kind: "ac-panel", manufacturer: "Kestrel", model: "KLC-125", busRatingA: 125, mainBreakerA: 60, voltage: "120/240" },
    { tag: "RSD-1", kind: "rapid-shutdown", manufacturer: "Kestrel", model: "KR-1", method: "array-boundary", controls: "PV-1" },
  ],
  arrays: [{ tag: "PV-1", moduleTag: "PV-M1", modulesInSeries: 3, stringsInParallel: 2, feedsTag: "CC-1" }],
  circuits: [
    { tag: "C-1", fromTag: "PV-1", toTag: "CC-1", kind: "pv-output", arrayTag: "PV-1", material: "cu", size: "10", insulation: "PV WIRE", insulationTempRatingC: 90, racewayType: "PVC-40", racewaySize: "3/4", lengthFt: 60, egcSize: "10", disconnectTags: ["DC-PV"] },
    { tag: "C-2", fromTag: "CC-1", toTag: "BUS-1", kind: "battery", size: "6", insulation: "THWN-2", insulationTempRatingC: 90, racewayType: "EMT", racewaySize: "3/4", lengthFt: 6, egcSize: "8", ocpdTag: "CB-CC" },
    { tag: "C-3", fromTag: "BUS-1", toTag: "BAT-1", kind: "battery", size: "4/0", insulation: "THHN", insulationTempRatingC: 90, racewayType: "EMT", racewaySize: "1-1/4", lengthFt: 4, egcSize: "4", ocpdTag: "F-BAT" },
    { tag: "C-4", fromTag: "BUS-1", toTag: "INV-1", kind: "inverter-dc-input", size: "2/0", insulation: "THHN", insulationTempRatingC: 90, racewayType: "EMT", racewaySize: "1-1/4", lengthFt: 5, egcSize: "6", ocpdTag: "CB-INV", disconnectTags: ["CB-INV"] },
    { tag: "C-5", fromTag: "GEN-1", toTag: "INV-1", kind: "generator-output", size: "10", insulation: "THWN-2", insulationTempRatingC: 90, racewayType: "PVC-40", racewaySize: "3/4", lengthFt: 40, egcSize: "10", disconnectTags: ["DS-GEN"] },
    { tag: "C-6", fromTag: "INV-1", toTag: "PNL-1", kind: "inverter-ac-output", size: "6", insulation: "THWN-2", insulationTempRatingC: 90, racewayType: "EMT", racewaySize: "1", lengthFt: 12, egcSize: "10" },
  ],
  loads: [{ name: "Well pump", watts: 750, hoursPerDay: 1.5, surgeW: 2200 }],
};

/**
 * Hybrid house with two arrays on two MPPT inputs, one circuit naming the
 * module rather than the array, and one with no size or EGC given: what a
 * half-entered record looks like.
 */
export const hybridInput: ProjectRecordInput = {
  name: "Alder Street hybrid",
  systemKind: "hybrid",
  site: { ...site, mounting: "roof", roofClearanceIn: 4 },
  jurisdiction,
  rapidShutdownMethod: "module-level",
  equipment: [
    { tag: "PV-M1", kind: "pv-module", manufacturer: "Brightfield", model: "BF-410M", pmaxW: 410, vocV: 37.4, iscA: 13.9 },
    { tag: "PV-M2", kind: "pv-module", manufacturer: "Brightfield", model: "BF-380", pmaxW: 380, vocV: 41.1, iscA: 11.6 },
    { tag: "HINV-1", kind: "hybrid-inverter", manufacturer: "Ambergate", model: "AG-H8", continuousW: 8000, nominalBatteryVoltageV: 48, acOutput: "120/240", listedMode: "multimode", mpptInputs: [{ id: "A", maxVoltageV: 500 }, { id: "B", maxVoltageV: 500 }] },
    { tag: "BAT-1", kind: "battery", manufacturer: "Stillwater", model: "SW-10", chemistry: "lfp", nominalVoltageV: 51.2, capacityKWh: 10.24 },
    { tag: "F-1", kind: "fuse", ratingA: 20, voltageRatingV: 600, currentType: "dc" },
    { tag: "MSP", kind: "ac-panel", busRatingA: 200, mainBreakerA: 200, voltage: "120/240" },
    { tag: "CB-PV", kind: "breaker", ratingA: 40, voltageRatingV: 240, currentType: "ac" },
    { tag: "SUBP-1", kind: "ac-panel", busRatingA: 100, mainBreakerA: 60, voltage: "120/240" },
  ],
  arrays: [
    { tag: "PV-A", moduleTag: "PV-M1", modulesInSeries: 10, stringsInParallel: 1, feedsTag: "HINV-1", mpptInputId: "A" },
    { tag: "PV-B", moduleTag: "PV-M2", modulesInSeries: 9, stringsInParallel: 1, feedsTag: "HINV-1", mpptInputId: "B" },
  ],
  circuits: [
    { tag: "S-A", fromTag: "PV-A", toTag: "HINV-1", kind: "pv-source", size: "10", insulation: "PV WIRE", insulationTempRatingC: 90, onRooftop: true, racewayType: "EMT", racewaySize: "3/4", currentCarryingConductors: 4, egcSize: "10", ocpdTag: "F-1" },
    { tag: "S-B", fromTag: "PV-M2", toTag: "HINV-1", kind: "pv-source", arrayTag: "PV-B", size: "10", insulation: "PV WIRE", insulationTempRatingC: 90, onRooftop: true, racewayType: "EMT", racewaySize: "3/4", currentCarryingConductors: 4, egcSize: "10" },
    { tag: "B-1", fromTag: "BAT-1", toTag: "HINV-1", kind: "battery", insulation: "THHN" },
    { tag: "AC-1", fromTag: "HINV-1", toTag: "MSP", kind: "inverter-ac-output", size: "8", insulation: "THWN-2", insulationTempRatingC: 90, racewayType: "EMT", racewaySize: "3/4", egcSize: "10", ocpdTag: "CB-PV" },
    { tag: "AC-2", fromTag: "MSP", toTag: "SUBP-1", kind: "ac-branch", size: "6", material: "al", insulation: "XHHW-2", racewayType: "PVC-40", racewaySize: "1", egcSize: "8", egcMaterial: "al" },
  ],
};

export const standAlone = (): ProjectRecord => parseRecord(standAloneInput);
export const hybrid = (): ProjectRecord => parseRecord(hybridInput);

/**
 * A record held in memory while it is being edited can name tags the
 * schema would refuse; the diagram must still draw it and show the fault.
 */
export function danglingRecord(): ProjectRecord {
  const r = hybrid();
  r.circuits = r.circuits.map((c) =>
    c.tag === "B-1" ? { ...c, ocpdTag: "F-9" } : c.tag === "AC-2" ? { ...c, toTag: "SUBP-9" } : c,
  );
  return r;
}

export const emptyRecord = (): ProjectRecord =>
  parseRecord({ name: "Empty", systemKind: "stand-alone", site, jurisdiction });

/**
 * A larger stand-alone system: two arrays on two controllers, each string its
 * own fused source circuit, two battery banks on a bus bar, a generator, a
 * main panel and a sub-panel. Parallel circuits between the same two boxes
 * and a wide fan-in are where a layout shows its seams.
 */
export const largeInput: ProjectRecordInput = {
  ...standAloneInput,
  name: "Quarry Road workshop",
  equipment: [
    ...(standAloneInput.equipment ?? []).filter((e) => e.tag !== "RSD-1"),
    { tag: "CC-2", kind: "charge-controller", manufacturer: "Northgate", model: "NG-250/100", controllerType: "mppt", maxPvInputVoltageV: 250, maxPvInputCurrentA: 100, ratedOutputCurrentA: 100, batteryVoltagesV: [48] },
    { tag: "F-S1", kind: "fuse", ratingA: 20, voltageRatingV: 600, currentType: "dc" },
    { tag: "F-S2", kind: "fuse", ratingA: 20, voltageRatingV: 600, currentType: "dc" },
    { tag: "CB-CC2", kind: "breaker", ratingA: 125, voltageRatingV: 150, currentType: "dc", interruptingRatingA: 10000 },
    { tag: "BAT-2", kind: "battery", manufacturer: "Stillwater", model: "SW-5100", chemistry: "lfp", nominalVoltageV: 51.2, capacityAh: 100, capacityKWh: 5.12, quantity: 3, listing: "UL 9540" },
    { tag: "F-BAT2", kind: "fuse", ratingA: 250, voltageRatingV: 160, currentType: "dc", interruptingRatingA: 20000 },
    { tag: "SUB-1", kind: "ac-panel", manufacturer: "Kestrel", model: "KLC-70", busRatingA: 70, mainBreakerA: 40, voltage: "120/240" },
    { tag: "CB-SUB", kind: "breaker", ratingA: 40, voltageRatingV: 240, currentType: "ac" },
  ],
  arrays: [
    { tag: "PV-1", moduleTag: "PV-M1", modulesInSeries: 3, stringsInParallel: 2, feedsTag: "CC-1" },
    { tag: "PV-2", moduleTag: "PV-M1", modulesInSeries: 4, stringsInParallel: 2, feedsTag: "CC-2" },
  ],
  circuits: [
    ...(standAloneInput.circuits ?? []),
    { tag: "S-1", fromTag: "PV-2", toTag: "CC-2", kind: "pv-source", arrayTag: "PV-2", size: "10", insulation: "PV WIRE", insulationTempRatingC: 90, racewayType: "PVC-40", racewaySize: "1", currentCarryingConductors: 4, lengthFt: 80, egcSize: "10", ocpdTag: "F-S1" },
    { tag: "S-2", fromTag: "PV-2", toTag: "CC-2", kind: "pv-source", arrayTag: "PV-2", size: "10", insulation: "PV WIRE", insulationTempRatingC: 90, racewayType: "PVC-40", racewaySize: "1", currentCarryingConductors: 4, lengthFt: 80, egcSize: "10", ocpdTag: "F-S2" },
    { tag: "C-7", fromTag: "CC-2", toTag: "BUS-1", kind: "battery", size: "2", insulation: "THWN-2", insulationTempRatingC: 90, racewayType: "EMT", racewaySize: "1", lengthFt: 6, egcSize: "6", ocpdTag: "CB-CC2" },
    { tag: "C-8", fromTag: "BUS-1", toTag: "BAT-2", kind: "battery", size: "4/0", insulation: "THHN", insulationTempRatingC: 90, racewayType: "EMT", racewaySize: "1-1/4", lengthFt: 4, egcSize: "4", ocpdTag: "F-BAT2" },
    { tag: "C-9", fromTag: "PNL-1", toTag: "SUB-1", kind: "ac-branch", size: "8", insulation: "THWN-2", insulationTempRatingC: 90, racewayType: "EMT", racewaySize: "3/4", lengthFt: 70, egcSize: "10", ocpdTag: "CB-SUB" },
  ],
};

export const large = (): ProjectRecord => parseRecord(largeInput);
