/**
 * 2. MPPT operating window: the string's Vmp at the hottest cell temperature
 * stays above the input's minimum (and above the battery's charge voltage
 * with headroom for a controller); its Isc stays within the input's current.
 */
import { Trace, v, type CheckContext } from "../context";
import { batteryMaxVoltage, systemBattery } from "../derive/battery";
import { arrayParts, pvInputOf } from "../derive/pv";
import { refs } from "../refs";
import { makeResult, needsInput, worst, type CheckDefinition } from "../result";
import type { PvArray } from "../../schemas/project-record";
import type { Indexed } from "../context";
import { arrayMaxVoltage } from "../derive/pv";
import type { CheckResult, CheckStatus, Remedy, RemedyChange } from "../types";

/** Module temperature above ambient at full sun, °C (common practice for rack and roof mounts). */
export const DEFAULT_MODULE_TEMP_RISE_C = 30;
/** Headroom a buck MPPT controller needs above the battery's charge voltage, V (common practice). */
export const CONTROLLER_HEADROOM_V = 5;
/** A PWM controller connects the array straight to the battery: Vmp need only clear the charge voltage by the switch's drop, V (common practice). */
export const PWM_HEADROOM_V = 1;

export const mpptWindow: CheckDefinition = {
  id: "mppt-window",
  title: "MPPT operating window at the design high temperature",
  scopeTopic: "listing-use",
  formula:
    "Vmp × modules in series × (1 + Vmp coefficient × (design high + module rise − 25 °C)) ≥ the input's lowest tracking voltage (and the battery charge voltage + headroom)",
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "listing-use");
    const out: CheckResult[] = [];
    for (const { item: array } of ctx.arrays.values()) {
      const t = new Trace();
      const parts = arrayParts(ctx, array.tag)!;
      const input = parts.module ? pvInputOf(ctx, parts) : undefined;
      const mod = parts.module;
      if (!mod || !input) {
        out.push(needsInput(this, { subject: array.tag, missing: [`${parts.array.path}.${mod ? "feedsTag" : "moduleTag"}`], codeRefs }));
        continue;
      }
      if (input.unresolved) t.need(input.unresolved, "MPPT input the string lands on", undefined);
      const n = array.modulesInSeries;
      t.read(`${parts.array.path}.modulesInSeries`, "Modules in series", n);
      const vmp = t.need(`${mod.path}.vmpV`, `Vmp of ${mod.item.tag}`, mod.item.vmpV, "V");
      const coeff = t.need(`${mod.path}.tempCoeffVmpPctPerC`, `Vmp temperature coefficient of ${mod.item.tag}`, mod.item.tempCoeffVmpPctPerC, "%/°C");
      const high = t.need("site.designHighTempC", "Design high temperature", ctx.record.site.designHighTempC, "°C");
      const rise = t.readOr("site.moduleTempRiseC", "Module temperature above ambient", ctx.record.site.moduleTempRiseC, DEFAULT_MODULE_TEMP_RISE_C, "°C");
      const minV = input.unresolved ? undefined : t.need(input.minOperatingPath, `Lowest tracking voltage of ${input.label}`, input.minOperatingV, "V");
      const isc = t.need(`${mod.path}.iscA`, `Isc of ${mod.item.tag}`, mod.item.iscA, "A");
      const maxI = input.unresolved ? undefined : t.need(input.maxCurrentPath, `Maximum input current of ${input.label}`, input.maxCurrentA, "A");
      let chargeV: number | undefined;
      if (input.isController) {
        const bat = systemBattery(ctx);
        if (bat) chargeV = batteryMaxVoltage(bat, t);
        else t.need("equipment", "A battery for the controller to charge", undefined);
      }
      if (t.missing.length > 0 || vmp === undefined || coeff === undefined || high === undefined) {
        out.push(needsInput(this, { subject: array.tag, inputs: t.inputs, missing: t.missing, codeRefs }));
        continue;
      }
      const cellC = high + rise;
      const hotVmp = vmp * n * (1 + (coeff / 100) * (cellC - 25));
      const floors: { label: string; v: number }[] = [];
      if (minV !== undefined) floors.push({ label: `${input.label} lowest tracking voltage`, v: minV });
      const fed = parts.feeds?.item;
      const headroom = fed?.kind === "charge-controller" && fed.controllerType === "pwm" ? PWM_HEADROOM_V : CONTROLLER_HEADROOM_V;
      if (chargeV !== undefined) floors.push({ label: `battery charge voltage ${chargeV.toFixed(1)} V + ${headroom} V headroom`, v: chargeV + headroom });
      const values = [
        v("cellTempC", "Cell temperature (high ambient + rise)", cellC, "°C"),
        v("hotVmpV", "String Vmp at the hot cell temperature", hotVmp, "V"),
        ...floors.map((f, i) => v(`floor${i}`, f.label, f.v, "V")),
      ];
      const statuses: CheckStatus[] = ["pass"];
      const problems: string[] = [];
      const low = floors.filter((f) => hotVmp < f.v);
      let tooManyStrings: { isc: number; maxI: number } | undefined;
      if (low.length) {
        statuses.push("fail");
        problems.push(`hot Vmp ${hotVmp.toFixed(1)} V is below the ${low.map((f) => `${f.label} (${f.v.toFixed(1)} V)`).join(", ")}`);
      }
      if (isc !== undefined && maxI !== undefined) {
        const stringsOnInput = array.stringsInParallel;
        const arrI = isc * stringsOnInput;
        values.push(v("arrayIscA", "Array Isc on the input", arrI, "A"), v("inputMaxA", `${input.label} maximum input current`, maxI, "A"));
        if (arrI > maxI) {
          statuses.push("fail");
          problems.push(`array Isc ${arrI.toFixed(2)} A exceeds the input's ${maxI} A`);
          tooManyStrings = { isc, maxI };
        }
      }
      const lowAmb = ctx.record.site.designLowTempC;
      if (input.maxOperatingV !== undefined && lowAmb !== undefined) {
        const coldVmp = vmp * n * (1 + (coeff / 100) * (lowAmb - 25));
        values.push(v("coldVmpV", "String Vmp at the design low temperature", coldVmp, "V"));
        if (coldVmp > input.maxOperatingV) {
          statuses.push("warning");
          problems.push(`cold Vmp ${coldVmp.toFixed(1)} V is above the tracking window's top (${input.maxOperatingV} V): output is clipped on cold days`);
        }
      }
      const status = worst(...statuses);
      const formula = `Vmp ${vmp} V × ${n} × (1 + ${coeff} %/°C × (${high} °C + ${rise} °C − 25 °C)) = ${hotVmp.toFixed(1)} V`;
      out.push(
        makeResult(this, {
          subject: array.tag,
          status,
          message:
            status === "pass"
              ? `${array.tag}: ${hotVmp.toFixed(1)} V at ${cellC} °C cell temperature stays inside the window of ${input.label}.`
              : `${array.tag}: ${problems.join("; ")}.`,
          ...(status === "pass" ? {} : { reason: problems.join("; ") }),
          remedy: () => windowRemedy(ctx, parts.array, hotVmp, low, tooManyStrings, input.label, input.maxVoltageV),
          values,
          formula,
          inputs: t.inputs,
          codeRefs,
        }),
      );
    }
    return out;
  },
};

/**
 * The string length that keeps the hot Vmp above the window's floor without the cold Voc passing the input's
 * maximum (690.7), and the number of strings whose Isc the input takes.
 */
function windowRemedy(
  ctx: CheckContext,
  array: Indexed<PvArray>,
  hotVmpV: number,
  low: { label: string; v: number }[],
  tooManyStrings: { isc: number; maxI: number } | undefined,
  inputLabel: string,
  inputMaxV: number | undefined,
): Remedy | undefined {
  const n = array.item.modulesInSeries;
  const lines: string[] = [];
  const changes: RemedyChange[] = [];
  if (low.length) {
    const floor = Math.max(...low.map((f) => f.v));
    const need = Math.ceil(floor / (hotVmpV / n) - 1e-9);
    const cold = arrayMaxVoltage(ctx, array.item.tag);
    const coldAtNeed = cold.ok ? (cold.value.maxVoltageV / n) * need : undefined;
    const ceiling = Math.min(inputMaxV ?? Infinity, ctx.record.site.occupancy === "one-two-family-dwelling" ? 600 : 1000);
    if (coldAtNeed !== undefined && coldAtNeed > ceiling) {
      lines.push(`No string length fits: ${need} modules clear ${floor.toFixed(1)} V when hot but reach ${coldAtNeed.toFixed(1)} V when cold, above ${ceiling} V; choose an input with a lower tracking voltage.`);
    } else {
      lines.push(`Put at least ${need} modules in series: ${need} × ${(hotVmpV / n).toFixed(2)} V = ${((hotVmpV / n) * need).toFixed(1)} V when hot, above ${floor.toFixed(1)} V${coldAtNeed !== undefined ? `, and ${coldAtNeed.toFixed(1)} V when cold` : ""}.`);
      changes.push({ path: `${array.path}.modulesInSeries`, value: need });
    }
  }
  if (tooManyStrings) {
    const strings = Math.floor(tooManyStrings.maxI / tooManyStrings.isc + 1e-9);
    if (strings < 1) lines.push(`One string's Isc (${tooManyStrings.isc} A) is above ${inputLabel}'s ${tooManyStrings.maxI} A: choose an input rated for it.`);
    else {
      lines.push(`Land at most ${strings} string${strings === 1 ? "" : "s"} on ${inputLabel}: ${strings} × ${tooManyStrings.isc} A ≤ ${tooManyStrings.maxI} A; put the rest on another input.`);
      changes.push({ path: `${array.path}.stringsInParallel`, value: strings });
    }
  }
  return lines.length ? { text: lines.join(" "), changes } : undefined;
}
