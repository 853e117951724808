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
import type { CheckResult, CheckStatus } from "../types";

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
