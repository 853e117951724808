/**
 * 11. Stand-alone sizing (common practice): the daily energy the battery
 * supplies — the AC loads through the inverter's efficiency, plus its idle draw
 * over 24 h; usable storage against the days of
 * autonomy (two to three by common practice); array energy against the daily
 * need at the site's sun hours. Sizing is not a code requirement, so a
 * shortfall warns.
 */
import { equipmentOfKind, Trace, v, type CheckContext } from "../context";
import { loadSummary } from "../load-summary";
import { refs } from "../refs";
import { makeResult, needsInput, worst, type CheckDefinition } from "../result";
import type { Equipment } from "../../schemas/project-record";
import type { Indexed } from "../context";
import type { CheckResult, CheckStatus, Remedy, RemedyChange } from "../types";

/** Days of autonomy when the record names none (common practice: two to three). */
export const DEFAULT_AUTONOMY_DAYS = 2;
/** Array output ÷ nameplate × sun hours, for wiring, temperature, soiling, charge efficiency (common practice, about 0.75). */
export const ARRAY_DERATE = 0.75;

export const standAloneSizing: CheckDefinition = {
  id: "stand-alone-sizing",
  title: "Stand-alone sizing",
  scopeTopic: "stand-alone-supply",
  formula:
    "daily energy = AC loads ÷ inverter efficiency + inverter idle W × 24 h; usable storage ÷ daily energy ≥ days of autonomy; array W × sun hours × 0.75 ≥ daily energy. Counted: inverter conversion loss and idle draw; the 0.75 array factor covers wiring, temperature, soiling and charging losses; battery round-trip loss and DC wiring loss on discharge are not counted",
  run(ctx: CheckContext): CheckResult[] {
    const r = ctx.record;
    const codeRefs = refs(ctx.edition, "stand-alone-supply");
    if (r.systemKind === "hybrid") {
      return [makeResult(this, { status: "not-applicable", message: "Grid-interactive system: the grid carries the days without sun.", reason: "system kind is hybrid", codeRefs })];
    }
    const t = new Trace();
    if (r.loads.length === 0) return [needsInput(this, { message: "Record the loads to size the system.", missing: ["loads"], codeRefs })];
    const s = loadSummary(r);
    r.equipment.forEach((e, i) => {
      if (s.inverterIdleMissing.includes(e.tag)) t.need(`equipment.${i}.idleW`, `Idle draw of ${e.tag}`, undefined, "W");
      else if ("idleW" in e) t.read(`equipment.${i}.idleW`, `Idle draw of ${e.tag}`, e.idleW, "W");
      if (s.inverterEfficiencyMissing.includes(e.tag)) t.need(`equipment.${i}.efficiencyPct`, `Efficiency of ${e.tag}`, undefined, "%");
      else if ("efficiencyPct" in e) t.read(`equipment.${i}.efficiencyPct`, `Efficiency of ${e.tag}`, e.efficiencyPct, "%");
    });
    const bats = equipmentOfKind(ctx, "battery");
    if (bats.length === 0) t.need("equipment", "A battery", undefined);
    for (const b of bats) {
      if (b.item.capacityKWh === undefined) {
        t.need(`${b.path}.capacityAh`, `Capacity of ${b.item.tag}`, b.item.capacityAh, "Ah");
        t.need(`${b.path}.nominalVoltageV`, `Nominal voltage of ${b.item.tag}`, b.item.nominalVoltageV, "V");
      } else t.read(`${b.path}.capacityKWh`, `Energy of ${b.item.tag}`, b.item.capacityKWh, "kWh");
      t.need(`${b.path}.usableDodPct`, `Usable depth of discharge of ${b.item.tag}`, b.item.usableDodPct, "%");
    }
    const sun = t.need("site.sunHoursPerDay", "Peak sun hours per day", r.site.sunHoursPerDay, "h");
    const daysGiven = t.read("daysOfAutonomy", "Days of autonomy", r.daysOfAutonomy, "days");
    const days = daysGiven ?? DEFAULT_AUTONOMY_DAYS;
    let arrayW = 0;
    for (const a of ctx.arrays.values()) {
      const m = ctx.equipment.get(a.item.moduleTag);
      if (m?.item.kind !== "pv-module") continue;
      const p = t.need(`${m.path}.pmaxW`, `Pmax of ${m.item.tag}`, m.item.pmaxW, "W");
      if (p !== undefined) arrayW += p * a.item.modulesInSeries * a.item.stringsInParallel;
    }
    if (t.missing.length || s.usableStorageWh === null) {
      return [needsInput(this, { inputs: t.inputs, missing: t.missing, codeRefs })];
    }
    const usable = s.usableStorageWh;
    const autonomy = s.autonomyDays ?? Infinity;
    const arrayWhPerDay = arrayW * (sun ?? 0) * ARRAY_DERATE;
    const statuses: CheckStatus[] = ["pass"];
    const notes: string[] = [];
    if (autonomy < days) {
      statuses.push("warning");
      notes.push(`usable storage ${Math.round(usable)} Wh carries ${autonomy.toFixed(1)} days, fewer than the ${days} days ${daysGiven !== undefined ? "designed for" : "of common practice"}`);
    }
    if (arrayWhPerDay < s.dailyTotalWh) {
      const gen = r.systemKind === "stand-alone-generator";
      statuses.push(gen ? "attest" : "warning");
      notes.push(
        `the array yields about ${Math.round(arrayWhPerDay)} Wh a day against ${Math.round(s.dailyTotalWh)} Wh needed${gen ? "; the generator must make up the difference — confirm its run hours and fuel" : ""}`,
      );
    }
    const status = worst(...statuses);
    return [
      makeResult(this, {
        status,
        message:
          status === "pass"
            ? `Daily need ${Math.round(s.dailyTotalWh)} Wh; storage carries ${Number.isFinite(autonomy) ? `${autonomy.toFixed(1)} days` : "the loads indefinitely (no daily energy recorded)"} (target ${days}); the array yields about ${Math.round(arrayWhPerDay)} Wh a day.`
            : `${notes.join("; ")}.`,
        ...(status === "pass" ? {} : { reason: notes.join("; ") }),
        remedy: () => sizingRemedy(ctx, bats, autonomy, days, arrayWhPerDay, s.dailyTotalWh),
        values: [
          v("dailyLoadWh", "AC loads per day", s.dailyLoadWh, "Wh"),
          v("inverterEfficiencyPct", "Inverter efficiency", s.inverterEfficiencyPct ?? "none", s.inverterEfficiencyPct === null ? "" : "%"),
          v("conversionLossWh", "Inverter conversion loss per day", s.conversionLossWh, "Wh"),
          v("idleWh", "Inverter idle over 24 h", s.idleWh, "Wh"),
          v("dailyTotalWh", "Daily need from the battery", s.dailyTotalWh, "Wh"),
          v("usableStorageWh", "Usable storage", usable, "Wh"),
          v("autonomyDays", "Days of autonomy", Number.isFinite(autonomy) ? autonomy : "no daily load", Number.isFinite(autonomy) ? "days" : ""),
          v("targetDays", daysGiven !== undefined ? "Days designed for" : "Days (common practice)", days, "days"),
          v("arrayW", "Array nameplate", arrayW, "W"),
          v("arrayWhPerDay", `Array energy (× ${sun} h × ${ARRAY_DERATE})`, arrayWhPerDay, "Wh"),
        ],
        formula: `Σ W × qty × h ${Math.round(s.dailyLoadWh)} Wh ÷ inverter efficiency ${s.inverterEfficiencyPct ?? "—"} % + idle W × 24 h ${Math.round(s.idleWh)} Wh = ${Math.round(s.dailyTotalWh)} Wh (counted: conversion loss and idle draw; battery round-trip and DC wiring losses not counted); Σ kWh × qty × DoD = ${Math.round(usable)} Wh; ${Math.round(usable)} ÷ ${Math.round(s.dailyTotalWh)} = ${Number.isFinite(autonomy) ? autonomy.toFixed(2) : "—"} days; ${arrayW} W × ${sun} h × ${ARRAY_DERATE} = ${Math.round(arrayWhPerDay)} Wh`,
        inputs: t.inputs,
        codeRefs,
      }),
    ];
  },
};

/**
 * Storage and array scale with the number of units and strings, so the count that meets the target is the present
 * count × target ÷ present figure, rounded up. Offered as a field change where one battery or one array is recorded.
 */
function sizingRemedy(
  ctx: CheckContext,
  bats: Indexed<Equipment & { quantity: number }>[],
  autonomyDays: number,
  targetDays: number,
  arrayWhPerDay: number,
  dailyWh: number,
): Remedy | undefined {
  const lines: string[] = [];
  const changes: RemedyChange[] = [];
  if (autonomyDays < targetDays && autonomyDays > 0) {
    const total = bats.reduce((n, b) => n + b.item.quantity, 0);
    const need = Math.ceil((total * targetDays) / autonomyDays - 1e-9);
    if (bats.length === 1) {
      lines.push(`Use ${need} × ${bats[0]!.item.tag} to carry ${targetDays} days (${total} carry ${autonomyDays.toFixed(1)}).`);
      changes.push({ path: `${bats[0]!.path}.quantity`, value: need });
    } else lines.push(`Add storage: about ${need} units of the present size carry ${targetDays} days (${total} carry ${autonomyDays.toFixed(1)}).`);
  }
  if (arrayWhPerDay < dailyWh && arrayWhPerDay > 0 && ctx.record.systemKind !== "stand-alone-generator") {
    const arrays = [...ctx.arrays.values()];
    if (arrays.length === 1) {
      const a = arrays[0]!;
      const need = Math.ceil((a.item.stringsInParallel * dailyWh) / arrayWhPerDay - 1e-9);
      lines.push(`Use ${need} strings in ${a.item.tag} to yield the ${Math.round(dailyWh)} Wh a day (then check the input's current).`);
      changes.push({ path: `${a.path}.stringsInParallel`, value: need });
    } else lines.push(`Add about ${Math.round(((dailyWh - arrayWhPerDay) / arrayWhPerDay) * 100)} % more array to yield the ${Math.round(dailyWh)} Wh a day.`);
  }
  return lines.length ? { text: lines.join(" "), changes } : undefined;
}
