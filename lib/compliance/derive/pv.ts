/** String voltage and current of a PV array, per 690.7(A) and 690.8(A). */
import type { Equipment, PvArray } from "../../schemas/project-record";
import { isInverter } from "../../schemas/vocabulary";
import { crystallineVoltageCorrectionFactorOrUndefined } from "../tables";
import { memo, Trace, v, type CheckContext, type Derived, type EquipmentOf, type Indexed } from "../context";
import type { CheckValue } from "../types";

export type PvModule = EquipmentOf<"pv-module">;

export interface ArrayParts {
  array: Indexed<PvArray>;
  module?: Indexed<PvModule>;
  feeds?: Indexed<Equipment>;
}

export function arrayParts(ctx: CheckContext, tag: string): ArrayParts | undefined {
  return memo(ctx, `array-parts:${tag}`, () => findArrayParts(ctx, tag));
}

function findArrayParts(ctx: CheckContext, tag: string): ArrayParts | undefined {
  const array = ctx.arrays.get(tag);
  if (!array) return undefined;
  const m = ctx.equipment.get(array.item.moduleTag);
  const feeds = ctx.equipment.get(array.item.feedsTag);
  return {
    array,
    ...(m && m.item.kind === "pv-module" ? { module: m as Indexed<PvModule> } : {}),
    ...(feeds ? { feeds } : {}),
  };
}

export interface ArrayVoltage {
  stringVocV: number;
  correctionFactor: number;
  method: "module coefficient, 690.7(A)(1)" | "Table 690.7(A)";
  lowTempC: number;
  maxVoltageV: number;
}

/** Voc × modules in series × the cold correction; the module's coefficient where given, else Table 690.7(A). */
export function arrayMaxVoltage(ctx: CheckContext, tag: string, lowTempOverrideC?: number): Derived<ArrayVoltage> {
  const compute = (): Derived<ArrayVoltage> => {
    const t = new Trace();
    const parts = arrayParts(ctx, tag);
    if (!parts || !parts.module) {
      return { ok: false, reason: `array ${tag} names no PV module`, inputs: [], missing: [`${parts?.array.path ?? "arrays"}.moduleTag`], values: [], formula: "" };
    }
    const { array, module } = parts;
    const n = t.need(`${array.path}.modulesInSeries`, "Modules in series", array.item.modulesInSeries);
    const voc = t.need(`${module.path}.vocV`, `Voc of ${module.item.tag}`, module.item.vocV, "V");
    const low =
      lowTempOverrideC ?? t.need("site.designLowTempC", "Design low temperature", ctx.record.site.designLowTempC, "°C");
    const coeff = t.read(`${module.path}.tempCoeffVocPctPerC`, "Voc temperature coefficient", module.item.tempCoeffVocPctPerC, "%/°C");
    if (n === undefined || voc === undefined || low === undefined) {
      return { ok: false, reason: "the string voltage needs the inputs named", ...t, values: [], formula: "" };
    }
    let factor: number;
    let method: ArrayVoltage["method"];
    if (coeff !== undefined) {
      // 690.7(A)(1): Voc rises as the cell cools below the 25 °C rating point.
      factor = Math.max(1, 1 + (coeff / 100) * (low - 25));
      method = "module coefficient, 690.7(A)(1)";
    } else {
      const f = crystallineVoltageCorrectionFactorOrUndefined(low);
      if (f === undefined) {
        t.missing.push(`${module.path}.tempCoeffVocPctPerC`);
        return {
          ok: false,
          reason: `Table 690.7(A) stops at −40 °C; below it the module's Voc coefficient is required`,
          ...t,
          values: [],
          formula: "",
        };
      }
      factor = f;
      method = "Table 690.7(A)";
    }
    const stringVocV = voc * n;
    const maxVoltageV = stringVocV * factor;
    const values: CheckValue[] = [
      v("stringVocV", "String Voc at 25 °C", stringVocV, "V"),
      v("correctionFactor", `Cold correction (${method})`, factor, ""),
      v("maxVoltageV", "Maximum string voltage", maxVoltageV, "V"),
    ];
    const formula =
      coeff !== undefined
        ? `Voc ${voc} V × ${n} in series × (1 + ${coeff} %/°C × (${low} °C − 25 °C)) = ${maxVoltageV.toFixed(1)} V`
        : `Voc ${voc} V × ${n} in series × ${factor} (Table 690.7(A) at ${low} °C) = ${maxVoltageV.toFixed(1)} V`;
    return { ok: true, value: { stringVocV, correctionFactor: factor, method, lowTempC: low, maxVoltageV }, values, formula, ...t };
  };
  if (lowTempOverrideC !== undefined) return compute();
  return memo(ctx, `array-voltage:${tag}`, compute);
}

/** Isc of one string and of the whole array, from the module datasheet. */
export function arrayIsc(ctx: CheckContext, tag: string): Derived<{ iscA: number; strings: number; impA?: number; vmpV?: number; n: number }> {
  return memo(ctx, `array-isc:${tag}`, () => {
    const t = new Trace();
    const parts = arrayParts(ctx, tag);
    if (!parts || !parts.module) {
      return { ok: false as const, reason: `array ${tag} names no PV module`, inputs: [], missing: [`${parts?.array.path ?? "arrays"}.moduleTag`], values: [], formula: "" };
    }
    const isc = t.need(`${parts.module.path}.iscA`, `Isc of ${parts.module.item.tag}`, parts.module.item.iscA, "A");
    if (isc === undefined) return { ok: false as const, reason: "the module's Isc is needed", ...t, values: [], formula: "" };
    const strings = parts.array.item.stringsInParallel;
    t.read(`${parts.array.path}.stringsInParallel`, "Strings in parallel", strings);
    return {
      ok: true as const,
      value: {
        iscA: isc,
        strings,
        n: parts.array.item.modulesInSeries,
        ...(parts.module.item.impA !== undefined ? { impA: parts.module.item.impA } : {}),
        ...(parts.module.item.vmpV !== undefined ? { vmpV: parts.module.item.vmpV } : {}),
      },
      values: [],
      formula: "",
      ...t,
    };
  });
}

export interface PvInputLimits {
  label: string;
  path: string;
  maxVoltageV?: number;
  maxVoltagePath: string;
  maxCurrentA?: number;
  maxCurrentPath: string;
  minOperatingV?: number;
  minOperatingPath: string;
  maxOperatingV?: number;
  maxOperatingPath?: string;
  isController: boolean;
  /** When the array feeds an inverter with several inputs and names none. */
  unresolved?: string;
}

/** The controller or MPPT input an array feeds, with its limits and their record paths. */
export function pvInputOf(ctx: CheckContext, parts: ArrayParts): PvInputLimits | undefined {
  const feeds = parts.feeds;
  if (!feeds) return undefined;
  const e = feeds.item;
  if (e.kind === "charge-controller") {
    return {
      label: `controller ${e.tag}`,
      path: feeds.path,
      ...(e.maxPvInputVoltageV !== undefined ? { maxVoltageV: e.maxPvInputVoltageV } : {}),
      maxVoltagePath: `${feeds.path}.maxPvInputVoltageV`,
      ...(e.maxPvInputCurrentA !== undefined ? { maxCurrentA: e.maxPvInputCurrentA } : {}),
      maxCurrentPath: `${feeds.path}.maxPvInputCurrentA`,
      ...(e.mpptMinVoltageV !== undefined ? { minOperatingV: e.mpptMinVoltageV } : {}),
      minOperatingPath: `${feeds.path}.mpptMinVoltageV`,
      isController: true,
    };
  }
  if (isInverter(e)) {
    const id = parts.array.item.mpptInputId;
    let idx = id !== undefined && id !== "" ? e.mpptInputs.findIndex((m) => m.id === id) : -1;
    if (idx < 0 && e.mpptInputs.length === 1 && (id === undefined || id === "")) idx = 0;
    if (idx < 0) {
      return {
        label: `inverter ${e.tag}`,
        path: feeds.path,
        maxVoltagePath: `${feeds.path}.mpptInputs`,
        maxCurrentPath: `${feeds.path}.mpptInputs`,
        minOperatingPath: `${feeds.path}.mpptInputs`,
        isController: false,
        unresolved:
          e.mpptInputs.length === 0 ? `${feeds.path}.mpptInputs` : `${parts.array.path}.mpptInputId`,
      };
    }
    const m = e.mpptInputs[idx]!;
    const p = `${feeds.path}.mpptInputs.${idx}`;
    return {
      label: `inverter ${e.tag} input ${m.id}`,
      path: p,
      ...(m.maxVoltageV !== undefined ? { maxVoltageV: m.maxVoltageV } : {}),
      maxVoltagePath: `${p}.maxVoltageV`,
      ...(m.maxCurrentA !== undefined ? { maxCurrentA: m.maxCurrentA } : {}),
      maxCurrentPath: `${p}.maxCurrentA`,
      ...(m.minOperatingVoltageV !== undefined ? { minOperatingV: m.minOperatingVoltageV } : {}),
      minOperatingPath: `${p}.minOperatingVoltageV`,
      ...(m.maxOperatingVoltageV !== undefined ? { maxOperatingV: m.maxOperatingVoltageV } : {}),
      maxOperatingPath: `${p}.maxOperatingVoltageV`,
      isController: false,
    };
  }
  return undefined;
}
