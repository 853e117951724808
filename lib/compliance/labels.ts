/**
 * The labels a system needs, with its computed values substituted, and where
 * each goes. The installer's label sheets and the packet's label schedule
 * render these; the labels check reports them. Wording is Sundocket's own,
 * carrying what the cited section requires; the AHJ may require more.
 */
import type { NecEdition, ProjectRecord } from "../schemas/project-record";
import { buildContext, equipmentOfKind, isPvCircuit, type CheckContext } from "./context";
import { circuitCurrent } from "./derive/circuit-current";
import { batteryMaxVoltage } from "./derive/battery";
import { arrayMaxVoltage } from "./derive/pv";
import { Trace } from "./context";
import { codeRef } from "./tables";
import { storageRefs } from "./refs";
import { circuitsNear, switchingDevicesOn } from "./derive/switching";
import { rapidShutdownApplies } from "./derive/rapid-shutdown-scope";
import { singleSupplyPanels } from "./derive/single-supply";

export type SignalWord = "DANGER" | "WARNING" | "CAUTION" | "NOTICE";

export interface LabelRequirement {
  /** Stable id: kind, and the equipment it goes on where there is one ("dc-source:PV-1"). */
  id: string;
  codeRef: string;
  signalWord: SignalWord;
  title: string;
  /** Printed lines, computed values substituted. */
  lines: string[];
  /** Where the label goes, in words an installer can follow. */
  location: string;
  equipmentTag?: string;
  /** Record paths whose absence left a value blank on the label. */
  missing?: string[];
}

const BLANK = "____";

function fmt(value: number, digits = 1): string {
  return value.toFixed(digits).replace(/\.0+$/, "");
}

export interface LabelOptions {
  /**
   * The date the label values were calculated (YYYY-MM-DD): the revision's date. The storage disconnect label
   * carries it; the engine reads no clock, so the caller supplies it.
   */
  calculatedOn?: string;
}

export function requiredLabels(record: ProjectRecord, edition: NecEdition = record.jurisdiction.necEdition, options: LabelOptions = {}): LabelRequirement[] {
  return labelsFor(buildContext(record, edition), options);
}

export function labelsFor(ctx: CheckContext, options: LabelOptions = {}): LabelRequirement[] {
  const ed = ctx.edition;
  const r = ctx.record;
  const out: LabelRequirement[] = [];
  const pvCircuits = ctx.circuits.filter((c) => isPvCircuit(c.item));

  // PV disconnects: line and load sides may both be live when open (690.13(B)), and the DC source label (690.53; 690.7(D) in 2023).
  const labelledDisconnects = new Set<string>();
  for (const { item: array, path } of ctx.arrays.values()) {
    const circuits = ctx.circuitsByArray.get(array.tag) ?? [];
    const devices = [...new Set(circuits.flatMap((c) => switchingDevicesOn(ctx, c.item)))];
    const fed = ctx.equipment.get(array.feedsTag);
    const builtIn = fed && "hasPvDisconnect" in fed.item && fed.item.hasPvDisconnect ? fed.item.tag : undefined;
    const where = devices.length ? devices : builtIn ? [builtIn] : [];
    for (const tag of devices) {
      if (labelledDisconnects.has(tag)) continue;
      labelledDisconnects.add(tag);
      out.push({
        id: `pv-disconnect:${tag}`,
        codeRef: codeRef(ed, "pv-disconnect"),
        signalWord: "WARNING",
        title: "PV SYSTEM DISCONNECT",
        lines: ["ELECTRIC SHOCK HAZARD", "TERMINALS ON THE LINE AND LOAD SIDES MAY BE ENERGIZED IN THE OPEN POSITION"],
        location: `On the face of PV disconnect ${tag}`,
        equipmentTag: tag,
      });
    }
    const missing: string[] = [];
    const vmax = arrayMaxVoltage(ctx, array.tag);
    if (!vmax.ok) missing.push(...vmax.missing);
    const voltageText = vmax.ok ? `${fmt(vmax.value.maxVoltageV)} V DC` : `${BLANK} V DC`;
    const lines: string[] = [];
    if (ed === "2023") {
      lines.push(`MAXIMUM DC VOLTAGE: ${voltageText}`);
    } else {
      lines.push(`MAXIMUM VOLTAGE: ${voltageText}`);
      const maxI = circuits.reduce<number | undefined>((m, c) => {
        const cur = circuitCurrent(ctx, c);
        if (!cur.ok) return m;
        return Math.max(m ?? 0, cur.value.currentA);
      }, undefined);
      if (maxI === undefined) missing.push(`${path}`);
      lines.push(`MAXIMUM CIRCUIT CURRENT: ${maxI !== undefined ? `${fmt(maxI, 2)} A` : `${BLANK} A`}`);
      if (fed?.item.kind === "charge-controller") {
        const out = fed.item.ratedOutputCurrentA;
        if (out === undefined) missing.push(`${fed.path}.ratedOutputCurrentA`);
        lines.push(`MAXIMUM RATED OUTPUT CURRENT OF THE CHARGE CONTROLLER: ${out !== undefined ? `${fmt(out)} A` : `${BLANK} A`}`);
      }
    }
    out.push({
      id: `dc-source:${array.tag}`,
      codeRef: codeRef(ed, "dc-source-label"),
      signalWord: "NOTICE",
      title: `PV DC POWER SOURCE — ${array.tag}`,
      lines,
      location: where.length ? `At the PV disconnect${where.length > 1 ? "s" : ""} ${where.join(", ")}` : `At the PV system disconnect for ${array.tag}`,
      ...(where[0] ? { equipmentTag: where[0] } : {}),
      ...(missing.length ? { missing: [...new Set(missing)] } : {}),
    });
  }

  if (pvCircuits.length > 0) {
    out.push({
      id: "pv-raceway",
      codeRef: codeRef(ed, "raceway-marking"),
      signalWord: "WARNING",
      title: "PHOTOVOLTAIC POWER SOURCE",
      lines: ["PHOTOVOLTAIC POWER SOURCE"],
      location:
        "On PV DC raceways, enclosures and cable assemblies in or on the building: at most every 10 ft, within 1 ft of turns and bends, and above and below penetrations of roofs, walls and floors",
    });
  }

  if (rapidShutdownApplies(ctx).applies) {
    out.push({
      id: "rapid-shutdown",
      codeRef: codeRef(ed, "rapid-shutdown-label"),
      signalWord: "WARNING",
      title: "SOLAR PV SYSTEM IS EQUIPPED WITH RAPID SHUTDOWN",
      lines: ["TURN RAPID SHUTDOWN SWITCH TO THE \"OFF\" POSITION TO SHUT DOWN PV SYSTEM AND REDUCE SHOCK HAZARD IN THE ARRAY"],
      location: "At each service equipment location, or an approved readily visible location that shows where the rapid-shutdown switch is",
    });
    out.push({
      id: "rapid-shutdown-switch",
      codeRef: codeRef(ed, "rapid-shutdown-label"),
      signalWord: "NOTICE",
      title: "RAPID SHUTDOWN SWITCH FOR SOLAR PV SYSTEM",
      lines: ["RAPID SHUTDOWN SWITCH FOR SOLAR PV SYSTEM"],
      location: "On or within 3 ft of the rapid-shutdown initiating device",
    });
  }

  const batteries = equipmentOfKind(ctx, "battery");
  const sources: string[] = [];
  if (ctx.arrays.size) sources.push(`PV SYSTEM (${[...ctx.arrays.keys()].join(", ")})`);
  if (batteries.length) sources.push(`ENERGY STORAGE (${batteries.map((b) => b.item.tag).join(", ")})`);
  for (const g of equipmentOfKind(ctx, "generator")) sources.push(`GENERATOR (${g.item.tag})`);
  const disconnectList = [...new Set(ctx.circuits.flatMap((c) => switchingDevicesOn(ctx, c.item)))];

  for (const b of batteries) {
    const t = new Trace();
    const devices = [...new Set(circuitsNear(ctx, b.item.tag).flatMap((c) => switchingDevicesOn(ctx, c.item)))];
    const nominal = t.need(`${b.path}.nominalVoltageV`, "Nominal voltage", b.item.nominalVoltageV, "V");
    const sc = t.need(`${b.path}.shortCircuitCurrentA`, "Available short-circuit current", b.item.shortCircuitCurrentA, "A");
    const maxV = batteryMaxVoltage(b, t);
    // The battery's main fuse or breaker (the largest on its circuits) clears a fault the bank feeds; its
    // time-current curve gives the clearing time at the bank's available fault current.
    const batteryCircuits = circuitsNear(ctx, b.item.tag);
    const rating = (e: ReturnType<typeof ctx.equipment.get>) =>
      e && "ratingA" in e.item && e.item.ratingA !== undefined ? e.item.ratingA : 0;
    const ocpd = batteryCircuits
      .map((c) => (c.item.ocpdTag ? ctx.equipment.get(c.item.ocpdTag) : undefined))
      .filter((e) => e && (e.item.kind === "fuse" || e.item.kind === "breaker"))
      .sort((x, y) => rating(y) - rating(x))[0];
    let clearing = `${BLANK} ms`;
    if (ocpd && (ocpd.item.kind === "fuse" || ocpd.item.kind === "breaker")) {
      const ms = t.need(`${ocpd.path}.clearingTimeMs`, "Clearing time", ocpd.item.clearingTimeMs, "ms");
      if (ms !== undefined) clearing = `${fmt(ms)} ms (${ocpd.item.tag})`;
    } else if (batteryCircuits[0]) {
      t.need(`${batteryCircuits[0].path}.ocpdTag`, "Overcurrent device", undefined, "");
    }
    out.push({
      id: `ess-disconnect:${b.item.tag}`,
      codeRef: storageRefs(ctx, "ess-label")[0]!,
      signalWord: "WARNING",
      title: "ENERGY STORAGE SYSTEM DISCONNECT",
      lines: [
        `NOMINAL VOLTAGE: ${nominal !== undefined ? `${fmt(nominal)} V DC` : `${BLANK} V DC`}`,
        ...(maxV !== undefined ? [`MAXIMUM VOLTAGE: ${fmt(maxV)} V DC`] : []),
        `MAXIMUM AVAILABLE SHORT-CIRCUIT CURRENT: ${sc !== undefined ? `${fmt(sc * b.item.quantity, 0)} A` : `${BLANK} A`}`,
        `ASSOCIATED CLEARING TIME: ${clearing}`,
        `DATE CALCULATED: ${options.calculatedOn ?? BLANK}`,
        "TERMINALS ON THE LINE AND LOAD SIDES MAY BE ENERGIZED IN THE OPEN POSITION",
      ],
      location: devices.length ? `On battery disconnect ${devices.join(", ")} of ${b.item.tag}` : `At the disconnect of ${b.item.tag}`,
      ...(devices[0] ? { equipmentTag: devices[0] } : { equipmentTag: b.item.tag }),
      ...(t.missing.length ? { missing: t.missing } : {}),
    });
  }

  if (r.systemKind === "hybrid") {
    out.push({
      id: "source-directory",
      codeRef: codeRef(ed, "source-directory"),
      signalWord: "CAUTION",
      title: "MULTIPLE SOURCES OF POWER",
      lines: [
        "THIS BUILDING IS ALSO SUPPLIED FROM:",
        ...sources,
        ...(disconnectList.length ? [`DISCONNECTS: ${disconnectList.join(", ")} — locations per the site plan`] : []),
      ],
      location: "At the service equipment, or an approved readily visible location, with a plan or directory showing each source's disconnect",
    });
    for (const p of equipmentOfKind(ctx, "ac-panel")) {
      const fromInverter = (ctx.circuitsByEndpoint.get(p.item.tag) ?? []).filter(
        (c) => c.item.kind === "inverter-ac-output" && c.item.ocpdTag !== undefined,
      );
      for (const c of fromInverter) {
        out.push({
          id: `backfed-breaker:${c.item.ocpdTag}`,
          codeRef: codeRef(ed, "busbar"),
          signalWord: "WARNING",
          title: "INVERTER OUTPUT CONNECTION",
          lines: ["DO NOT RELOCATE THIS OVERCURRENT DEVICE"],
          location: `At breaker ${c.item.ocpdTag} in panel ${p.item.tag}, at the end of the busbar opposite the main`,
          equipmentTag: c.item.ocpdTag!,
        });
      }
    }
  } else {
    out.push({
      id: "stand-alone-plaque",
      codeRef: codeRef(ed, "stand-alone-plaque"),
      signalWord: "NOTICE",
      title: "STAND-ALONE POWER SYSTEM",
      lines: [
        "THIS BUILDING IS SUPPLIED BY A STAND-ALONE SYSTEM:",
        ...sources,
        ...(disconnectList.length ? [`DISCONNECTS: ${disconnectList.join(", ")} — locations per the site plan`] : []),
      ],
      location: "On the building's exterior at the service location, or an approved readily visible location",
    });
  }

  for (const p of singleSupplyPanels(ctx)) {
    out.push({
      id: `single-120v-supply:${p.panel.item.tag}`,
      codeRef: codeRef(ed, "stand-alone-label"),
      signalWord: "WARNING",
      title: "SINGLE 120-VOLT SUPPLY",
      lines: ["DO NOT CONNECT MULTIWIRE BRANCH CIRCUITS!"],
      location: `On distribution panel ${p.panel.item.tag}, in a conspicuous place`,
      equipmentTag: p.panel.item.tag,
    });
  }

  // 110.16 covers equipment in other than dwelling units.
  if (r.site.occupancy !== "one-two-family-dwelling") {
    for (const p of equipmentOfKind(ctx, "ac-panel")) {
      out.push({
        id: `arc-flash:${p.item.tag}`,
        codeRef: codeRef(ed, "arc-flash-label"),
        signalWord: "WARNING",
        title: "ARC FLASH AND SHOCK HAZARD",
        lines: ["APPROPRIATE PPE REQUIRED", "DE-ENERGIZE BEFORE SERVICING"],
        location: `On panel ${p.item.tag}, visible before examination, adjustment, servicing or maintenance`,
        equipmentTag: p.item.tag,
      });
    }
  }
  return out;
}
