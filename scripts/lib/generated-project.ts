import type { ProjectRecordInput } from "../../lib/schemas/project-record";

/** A plausible large stand-alone plant: strings on many controllers, a battery bus, many AC branch circuits. */
export function generatedProject(circuits: number): ProjectRecordInput {
  const strings = Math.max(1, Math.floor(circuits / 4));
  const branches = Math.max(0, circuits - 2 * strings - 1);
  const equipment: ProjectRecordInput["equipment"] = [
    { tag: "MOD-1", kind: "pv-module", pmaxW: 400, vocV: 48.6, iscA: 10.45, vmpV: 40.4, impA: 9.9, tempCoeffVocPctPerC: -0.29, tempCoeffVmpPctPerC: -0.37, maxSeriesFuseA: 20, maxSystemVoltageV: 1000, listing: "UL 61730" },
    { tag: "BAT-1", kind: "battery", chemistry: "lfp", nominalVoltageV: 51.2, capacityKWh: 5.12, quantity: 4, maxContinuousDischargeA: 100, shortCircuitCurrentA: 4500, usableDodPct: 90, listing: "UL 9540" },
    { tag: "BB-1", kind: "busbar", busRatingA: 2000 },
    { tag: "INV-1", kind: "inverter-charger", continuousW: 15000, surgeW: 30000, nominalBatteryVoltageV: 51.2, minBatteryVoltageV: 44, efficiencyPct: 95, idleW: 60, acOutput: "120/240", acOutputVoltageV: 240, maxAcOutputCurrentA: 62.5, listedMode: "stand-alone", listing: "UL 1741" },
    { tag: "P-1", kind: "ac-panel", busRatingA: 400, mainBreakerA: 100, voltage: "120/240", hasMultiwireBranchCircuits: false },
    { tag: "F-1", kind: "fuse", ratingA: 400, voltageRatingV: 125, currentType: "dc", interruptingRatingA: 20000, distanceFromBatteryFt: 2 },
    { tag: "DS-1", kind: "disconnect", ratingA: 400, voltageRatingV: 125, currentType: "dc" },
    { tag: "CB-M", kind: "breaker", ratingA: 80, voltageRatingV: 240, currentType: "ac", interruptingRatingA: 10000 },
  ];
  const arrays: ProjectRecordInput["arrays"] = [];
  const list: ProjectRecordInput["circuits"] = [
    { tag: "C-INV", fromTag: "BB-1", toTag: "INV-1", kind: "inverter-dc-input", size: "250", parallelSets: 2, insulationTempRatingC: 90, terminalTempRatingC: 75, currentCarryingConductors: 4, lengthFt: 10, ocpdTag: "F-1", disconnectTags: ["DS-1"], egcSize: "3" },
  ];
  for (let i = 0; i < strings; i++) {
    equipment.push(
      { tag: `CC-${i}`, kind: "charge-controller", controllerType: "mppt", maxPvInputVoltageV: 150, maxPvInputCurrentA: 30, mpptMinVoltageV: 60, ratedOutputCurrentA: 15, listing: "UL 1741" },
      { tag: `PVD-${i}`, kind: "disconnect", ratingA: 32, voltageRatingV: 600, currentType: "dc" },
      { tag: `CB-${i}`, kind: "breaker", ratingA: 20, voltageRatingV: 125, currentType: "dc", interruptingRatingA: 25000, distanceFromBatteryFt: 3 },
    );
    arrays.push({ tag: `PV-${i}`, moduleTag: "MOD-1", modulesInSeries: 2, stringsInParallel: 1, feedsTag: `CC-${i}` });
    list.push(
      { tag: `S-${i}`, fromTag: `PV-${i}`, toTag: `CC-${i}`, kind: "pv-source", size: "10", insulationTempRatingC: 90, terminalTempRatingC: 75, currentCarryingConductors: 2, lengthFt: 40 + (i % 30), disconnectTags: [`PVD-${i}`], egcSize: "10" },
      { tag: `B-${i}`, fromTag: `CC-${i}`, toTag: "BB-1", kind: "battery", size: "10", insulationTempRatingC: 90, terminalTempRatingC: 75, currentCarryingConductors: 2, lengthFt: 6, ocpdTag: `CB-${i}`, egcSize: "10" },
    );
  }
  for (let i = 0; i < branches; i++) {
    equipment.push({ tag: `BR-${i}`, kind: "breaker", ratingA: 20, voltageRatingV: 240, currentType: "ac", interruptingRatingA: 10000 }, { tag: `LD-${i}`, kind: "disconnect", ratingA: 30, voltageRatingV: 240, currentType: "ac" });
    list.push({ tag: `A-${i}`, fromTag: "P-1", toTag: `LD-${i}`, kind: "ac-branch", loadCurrentA: 8 + (i % 7), nominalVoltageV: 120, size: "12", insulationTempRatingC: 90, terminalTempRatingC: 60, currentCarryingConductors: 2 + (i % 5), lengthFt: 30 + (i % 90), ocpdTag: `BR-${i}`, egcSize: "12" });
  }
  return {
    name: `Generated ${circuits}-circuit project`,
    systemKind: "stand-alone",
    site: { occupancy: "other-building", mounting: "ground", designLowTempC: -25, designHighTempC: 35, sunHoursPerDay: 4, batteryLocation: "storage-room" },
    jurisdiction: { name: "Bench County", necEdition: "2023" },
    daysOfAutonomy: 2,
    equipment,
    arrays,
    circuits: list,
    loads: [{ name: "Lighting", watts: 400, hoursPerDay: 6 }, { name: "Pump", watts: 1200, hoursPerDay: 2, surgeW: 3600 }],
  };
}
