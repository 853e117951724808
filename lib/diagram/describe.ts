/**
 * The words on the one-line diagram: box titles and rating lines for each
 * equipment kind, and the conductor callout for each circuit. Kept apart
 * from the geometry so the schedules and the diagram can be compared line
 * for line by a reviewer.
 */
import type { Circuit, Equipment, ProjectRecord, PvArray } from "../schemas/project-record";
import { CIRCUIT_KIND_WORDS, isInverter, isKcmilSize, PHASE_WORDS } from "../schemas/vocabulary";

export const CIRCUIT_KIND_LABELS: Record<Circuit["kind"], string> = CIRCUIT_KIND_WORDS;

const KIND_TITLES: Record<Equipment["kind"], string> = {
  "pv-module": "PV MODULE",
  "charge-controller": "CHARGE CONTROLLER",
  inverter: "INVERTER",
  "inverter-charger": "INVERTER-CHARGER",
  "hybrid-inverter": "HYBRID INVERTER",
  battery: "BATTERY",
  generator: "GENERATOR",
  disconnect: "DISCONNECT",
  fuse: "FUSE",
  breaker: "CIRCUIT BREAKER",
  "rapid-shutdown": "RAPID SHUTDOWN",
  "ac-panel": "AC PANEL",
  busbar: "BUS BAR",
};

const CHEMISTRY: Record<string, string> = {
  lfp: "LFP",
  nmc: "NMC",
  "lead-acid-flooded": "flooded lead-acid",
  "lead-acid-agm": "AGM lead-acid",
  "nickel-iron": "nickel-iron",
  other: "",
};

/** Figures as a drawing shows them: no trailing zeros, at most two decimals. */
export function fmt(value: number, decimals = 2): string {
  const rounded = Number(value.toFixed(decimals));
  return String(Object.is(rounded, -0) ? 0 : rounded);
}

function join(parts: (string | undefined | false | null)[], sep = " "): string {
  return parts.filter((p): p is string => typeof p === "string" && p.trim() !== "").join(sep);
}

function makeModel(e: { manufacturer: string; model: string }): string {
  return join([e.manufacturer, e.model]);
}

function currentType(t: "ac" | "dc" | "ac-dc" | undefined): string | undefined {
  if (!t) return undefined;
  return t === "ac-dc" ? "AC/DC" : t.toUpperCase();
}

export function equipmentTitle(e: Equipment): string {
  if (e.kind === "disconnect" && e.currentType) return `${currentType(e.currentType)} DISCONNECT`;
  return KIND_TITLES[e.kind];
}

/** Rating lines under the tag: what a plan reviewer looks for on each box. */
export function equipmentLines(e: Equipment): string[] {
  const lines: string[] = [];
  const mm = makeModel(e);
  if (mm) lines.push(mm);
  switch (e.kind) {
    case "pv-module":
      lines.push(
        join([
          e.pmaxW !== undefined && `${fmt(e.pmaxW)} W`,
          e.vocV !== undefined && `Voc ${fmt(e.vocV)} V`,
          e.iscA !== undefined && `Isc ${fmt(e.iscA)} A`,
        ], ", "),
      );
      break;
    case "charge-controller":
      lines.push(
        join([
          e.controllerType?.toUpperCase(),
          e.maxPvInputVoltageV !== undefined && `PV in max ${fmt(e.maxPvInputVoltageV)} V`,
        ]),
      );
      lines.push(
        join([
          e.maxPvInputCurrentA !== undefined && `PV in ${fmt(e.maxPvInputCurrentA)} A`,
          e.ratedOutputCurrentA !== undefined && `out ${fmt(e.ratedOutputCurrentA)} A`,
          e.batteryVoltagesV.length > 0 && `${e.batteryVoltagesV.map((v) => fmt(v)).join("/")} V DC`,
        ], ", "),
      );
      break;
    case "inverter":
    case "inverter-charger":
    case "hybrid-inverter":
      lines.push(
        join([
          e.continuousW !== undefined && `${fmt(e.continuousW)} W cont.`,
          e.surgeW !== undefined && `${fmt(e.surgeW)} W surge`,
        ], ", "),
      );
      lines.push(
        join([
          e.nominalBatteryVoltageV !== undefined && `${fmt(e.nominalBatteryVoltageV)} V DC in`,
          e.acOutput !== undefined
            ? `${e.acOutput} V AC${e.acOutputPhases > 1 ? ` ${PHASE_WORDS[e.acOutputPhases]}` : ""} out`
            : e.acOutputVoltageV !== undefined && `${fmt(e.acOutputVoltageV)} V AC out`,
        ], ", "),
      );
      if (e.mpptInputs.length > 0) lines.push(`MPPT inputs ${e.mpptInputs.map((m) => m.id).join(", ")}`);
      if (e.listedMode) lines.push(`listed ${e.listedMode}`);
      break;
    case "battery":
      lines.push(
        join([
          e.chemistry && CHEMISTRY[e.chemistry],
          e.nominalVoltageV !== undefined && `${fmt(e.nominalVoltageV)} V`,
          e.capacityAh !== undefined && `${fmt(e.capacityAh)} Ah`,
          e.capacityKWh !== undefined && `${fmt(e.capacityKWh)} kWh`,
        ]),
      );
      if (e.listing) lines.push(e.listing);
      break;
    case "generator":
      lines.push(
        join([
          e.ratedKW !== undefined && `${fmt(e.ratedKW)} kW`,
          e.output !== undefined ? `${e.output} V` : e.voltageV !== undefined && `${fmt(e.voltageV)} V`,
          e.fuel,
        ]),
      );
      if (e.outputBreakerA !== undefined) lines.push(`output breaker ${fmt(e.outputBreakerA)} A`);
      break;
    case "disconnect":
    case "fuse":
    case "breaker":
      lines.push(deviceRating(e));
      break;
    case "rapid-shutdown":
      if (e.method) lines.push(e.method.replace(/-/g, " "));
      if (e.controls) lines.push(`controls ${e.controls}`);
      break;
    case "ac-panel":
    case "busbar":
      lines.push(
        join([
          e.busRatingA !== undefined && `bus ${fmt(e.busRatingA)} A`,
          e.mainBreakerA !== undefined && `main ${fmt(e.mainBreakerA)} A`,
          e.voltage !== undefined && `${e.voltage} V`,
        ], ", "),
      );
      break;
  }
  if (e.quantity > 1) lines.push(`quantity ${e.quantity}`);
  return lines.filter((l) => l !== "");
}

export function deviceRating(e: Extract<Equipment, { kind: "disconnect" | "fuse" | "breaker" }>): string {
  return join([
    e.ratingA !== undefined && `${fmt(e.ratingA)} A`,
    e.voltageRatingV !== undefined && `${fmt(e.voltageRatingV)} V`,
    currentType(e.currentType),
    e.interruptingRatingA !== undefined && `${fmt(e.interruptingRatingA / 1000, 1)} kAIC`,
  ]);
}

export function arrayLines(a: PvArray, module: Equipment | undefined): string[] {
  const count = a.modulesInSeries * a.stringsInParallel;
  const lines = [
    `${a.modulesInSeries} in series x ${a.stringsInParallel} string${a.stringsInParallel === 1 ? "" : "s"} = ${count} module${count === 1 ? "" : "s"}`,
  ];
  if (module && module.kind === "pv-module") {
    lines.push(join([module.tag, makeModel(module)]));
    if (module.pmaxW !== undefined) {
      lines.push(`${fmt(module.pmaxW)} W each, ${fmt((module.pmaxW * count) / 1000)} kW STC`);
    }
    const stc = join([
      module.vocV !== undefined && `Voc ${fmt(module.vocV)} V`,
      module.iscA !== undefined && `Isc ${fmt(module.iscA)} A`,
    ], ", ");
    if (stc) lines.push(`module ${stc}`);
  } else {
    lines.push(`module ${a.moduleTag}`);
  }
  lines.push(`feeds ${a.feedsTag}${a.mpptInputId ? ` input ${a.mpptInputId}` : ""}`);
  return lines;
}

/** "#10 AWG", "1/0 AWG", "250 kcmil" — as written on a conductor schedule. */
export function sizeText(size: string, withUnit = true): string {
  if (isKcmilSize(size)) return `${size} kcmil`;
  const awg = size.includes("/") ? size : `#${size}`;
  return withUnit ? `${awg} AWG` : awg;
}

type VoltageSpec = "120" | "240" | "120/240" | "208" | "277/480";

/** Conductors per set from the circuit kind and the AC system it serves; undefined when not known. */
export function conductorsPerSet(c: Circuit, record: ProjectRecord): number | undefined {
  if (c.kind === "pv-source" || c.kind === "pv-output" || c.kind === "battery" || c.kind === "inverter-dc-input") {
    // Two-wire DC circuit: positive and negative.
    return 2;
  }
  const ends = [c.fromTag, c.toTag]
    .map((t) => record.equipment.find((e) => e.tag === t))
    .filter((e): e is Equipment => e !== undefined);
  let spec: VoltageSpec | undefined;
  let phases = 1;
  for (const e of ends) {
    if (spec) break;
    if (isInverter(e)) {
      spec = e.acOutput;
      phases = e.acOutputPhases;
    } else if (e.kind === "generator") {
      spec = e.output;
    } else if (e.kind === "ac-panel" && e.voltage && ["120", "240", "120/240", "208", "277/480"].includes(e.voltage)) {
      spec = e.voltage as VoltageSpec;
    }
  }
  // Split phase: L1, L2 and the neutral, whatever single voltage was recorded.
  if (phases === 2) return 3;
  switch (spec) {
    case "120":
      return 2; // line and neutral
    case "240":
      return phases === 3 ? 3 : 2;
    case "120/240":
      return 3; // L1, L2, neutral
    case "208":
      return phases === 3 ? 4 : 2; // 208Y/120: three lines and neutral, or two lines single-phase
    case "277/480":
      return 4;
    default:
      return undefined;
  }
}

export interface CircuitText {
  heading: string;
  callout: string[];
  trouble: string[];
}

export function circuitText(c: Circuit, record: ProjectRecord): CircuitText {
  const trouble: string[] = [];
  const callout: string[] = [];
  const perSet = conductorsPerSet(c, record);
  const material = c.material === "al" ? "Al" : "Cu";
  const insulation = join([c.insulation, c.insulationTempRatingC !== undefined && `${c.insulationTempRatingC} °C`]);
  if (c.size) {
    const body = join([sizeText(c.size), material, insulation]);
    if (perSet === undefined) {
      callout.push(c.parallelSets > 1 ? `${c.parallelSets} sets of ${body}` : body);
      trouble.push("conductor count: AC voltage not given");
    } else if (c.parallelSets > 1) {
      callout.push(`${c.parallelSets} sets of ${perSet} ${body}`);
    } else {
      callout.push(`${perSet} ${body}`);
    }
  } else {
    trouble.push("conductor size not given");
    if (insulation || c.material) callout.push(join([material, insulation]));
  }
  if (c.egcSize) {
    callout.push(`1 ${sizeText(c.egcSize, false)}${c.egcMaterial === "al" ? " Al" : ""} EGC`);
  } else {
    trouble.push("EGC size not given");
  }
  const racewaySize = c.racewaySize.trim();
  const racewaySizeText = racewaySize === "" ? "" : /^[\d\s/.-]+$/.test(racewaySize) ? `${racewaySize} in` : racewaySize;
  const count = perSet === undefined ? undefined : perSet * c.parallelSets;
  const run = join([
    join([racewaySizeText, c.racewayType]),
    c.currentCarryingConductors !== undefined &&
      c.currentCarryingConductors !== count &&
      `${c.currentCarryingConductors} CCC in raceway`,
    c.onRooftop && "rooftop",
    c.lengthFt !== undefined && `${fmt(c.lengthFt, 0)} ft`,
  ], ", ");
  if (run) callout.push(run);
  return { heading: `${c.tag}  ${CIRCUIT_KIND_LABELS[c.kind]}`, callout, trouble };
}
