/**
 * The demo firm's three standard kits as project templates: what Quillfeather
 * Solar Co. builds again and again, with its usual makes and models and
 * conductor sizes, and no site. Invented products, from the demo library.
 */
import fs from "node:fs";
import path from "node:path";
import { projectRecordSchema, type ProjectRecordInput } from "../lib/schemas/project-record";
import { designOf, type TemplateDesign } from "../lib/schemas/project-template";

type Input = ProjectRecordInput;

/** A design from one of the demo project files, lengths left for the site, without the loads (each client's own). */
function fromExample(file: string, drop: { tags?: string[] } = {}): TemplateDesign {
  const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync(path.resolve(process.cwd(), file), "utf8")));
  const dropped = new Set(drop.tags ?? []);
  const design = designOf(record);
  return {
    ...design,
    equipment: design.equipment.filter((e) => !dropped.has(e.tag)),
    circuits: design.circuits
      .filter((c) => !dropped.has(c.fromTag) && !dropped.has(c.toTag))
      .map(({ lengthFt: _site, ...c }) => ({ ...c, disconnectTags: c.disconnectTags.filter((t) => !dropped.has(t)) })),
    loads: [],
  };
}

const cabinCircuit = (tag: string, fromTag: string, toTag: string, kind: string, size: string, egcSize: string, ocpdTag?: string) => ({
  tag,
  fromTag,
  toTag,
  kind,
  ...(fromTag === "PV-1" ? { arrayTag: "PV-1" } : {}),
  material: "cu",
  size,
  insulation: "THWN-2",
  insulationTempRatingC: 90,
  currentCarryingConductors: 2,
  ...(ocpdTag ? { ocpdTag } : {}),
  egcSize,
  egcMaterial: "cu",
});

/** Two modules in series on a controller, a 24 V lithium battery, an inverter-charger, a generator and a load centre. */
const CABIN: Input = {
  name: "cabin",
  systemKind: "stand-alone-generator",
  daysOfAutonomy: 2,
  site: { occupancy: "one-two-family-dwelling", mounting: "ground" },
  jurisdiction: { name: "template", necEdition: "2023" },
  equipment: [
    { tag: "MOD-1", kind: "pv-module", manufacturer: "Brightfell", model: "BF-400T", quantity: 2, listing: "UL 1703", pmaxW: 400, vocV: 48.6, iscA: 10.45, vmpV: 40.4, impA: 9.9, tempCoeffVocPctPerC: -0.29, tempCoeffVmpPctPerC: -0.37, maxSeriesFuseA: 20, maxSystemVoltageV: 1000 },
    { tag: "CC-1", kind: "charge-controller", manufacturer: "Korvane", model: "KV-150/30", listing: "UL 1741", controllerType: "mppt", maxPvInputVoltageV: 150, maxPvInputCurrentA: 30, mpptMinVoltageV: 34, ratedOutputCurrentA: 30, batteryVoltagesV: [12, 24, 48] },
    { tag: "BAT-1", kind: "battery", manufacturer: "Ostin Cells", model: "OC-24200", listing: "UL 9540, UL 1973", chemistry: "lfp", nominalVoltageV: 25.6, capacityAh: 200, capacityKWh: 5.12, maxContinuousDischargeA: 200, shortCircuitCurrentA: 6000, usableDodPct: 90, maxConnectionsPerTerminal: 3, maxChargeVoltageV: 28.8 },
    { tag: "INV-1", kind: "inverter-charger", manufacturer: "Halden Power", model: "HC-3024", listing: "UL 1741", continuousW: 3000, surgeW: 6000, nominalBatteryVoltageV: 25.6, minBatteryVoltageV: 21, acOutputVoltageV: 120, acOutput: "120", acOutputPhases: 1, maxAcOutputCurrentA: 25, acInputCurrentLimitA: 30, idleW: 20, efficiencyPct: 92, listedMode: "stand-alone" },
    { tag: "GEN-1", kind: "generator", manufacturer: "Pellham", model: "PG-3600P", listing: "UL 2201", ratedKW: 3.6, voltageV: 120, output: "120", fuel: "propane", hasOutputDisconnect: true, outputBreakerA: 30 },
    { tag: "P-1", kind: "ac-panel", manufacturer: "Tessen", model: "TL-12 load centre", listing: "UL 67", busRatingA: 100, voltage: "120/240", hasMultiwireBranchCircuits: false },
    { tag: "CB-1", kind: "breaker", manufacturer: "Korvane", model: "KB-40DC", listing: "UL 489", ratingA: 40, voltageRatingV: 125, currentType: "dc", interruptingRatingA: 10000 },
    { tag: "F-1", kind: "fuse", manufacturer: "Halden Power", model: "Class T 200 A in holder", listing: "UL 248-15", ratingA: 200, voltageRatingV: 160, currentType: "dc", interruptingRatingA: 20000 },
    { tag: "CB-2", kind: "breaker", manufacturer: "Tessen", model: "TB-40 back-fed main", listing: "UL 489", ratingA: 40, voltageRatingV: 240, currentType: "ac", interruptingRatingA: 10000 },
    { tag: "CB-3", kind: "breaker", manufacturer: "Tessen", model: "TB-40 back-fed main", listing: "UL 489", ratingA: 40, voltageRatingV: 240, currentType: "ac", interruptingRatingA: 10000 },
  ] as Input["equipment"],
  arrays: [{ tag: "PV-1", moduleTag: "MOD-1", modulesInSeries: 2, stringsInParallel: 1, feedsTag: "CC-1" }],
  circuits: [
    cabinCircuit("C-1", "PV-1", "CC-1", "pv-source", "12", "12"),
    cabinCircuit("C-2", "CC-1", "BAT-1", "battery", "8", "10", "CB-1"),
    cabinCircuit("C-3", "BAT-1", "INV-1", "inverter-dc-input", "3/0", "6", "F-1"),
    cabinCircuit("C-4", "GEN-1", "INV-1", "generator-output", "8", "10", "CB-2"),
    cabinCircuit("C-5", "INV-1", "P-1", "inverter-ac-output", "8", "10", "CB-3"),
  ] as Input["circuits"],
};

export function demoTemplates(): { name: string; description: string; design: TemplateDesign }[] {
  return [
    {
      name: "Lone module, small inverter",
      description: "One module on a small controller, a 12 V battery and a 600 W inverter: a stall, a shed, a gate.",
      design: fromExample("examples/market-stall.json"),
    },
    {
      name: "Cabin: series modules, inverter-charger and generator",
      description: "Two modules in series on a charge controller, a 24 V lithium battery, an inverter-charger, an AC panel and a propane generator.",
      design: designOf(projectRecordSchema.parse(CABIN)),
    },
    {
      name: "Hybrid all-in-one, two strings, rack batteries",
      description: "A hybrid inverter with two long strings on its two MPPT inputs, rack battery modules on a bus bar, a main panel.",
      design: fromExample("examples/ferncliff-farmhouse.json", { tags: ["GEN-1", "CB-1"] }),
    },
  ];
}
