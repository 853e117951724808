/**
 * DC arc-fault protection (690.11): PV system DC circuits at 80 V or more between any two conductors are protected
 * by a listed PV arc-fault circuit interrupter or equipment listed to provide it (UL 1699B). The equipment the array
 * feeds says whether it does. The voltage compared is the maximum PV system voltage (690.7), the highest the
 * circuit reaches: a string below 80 V there never operates at 80 V.
 */
import type { Equipment } from "../../schemas/project-record";
import { isInverter, Trace, v, type CheckContext, type Indexed } from "../context";
import { arrayMaxVoltage, arrayParts } from "../derive/pv";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

/** 690.11: the protection applies at 80 V DC or more between any two conductors. */
export const ARC_FAULT_THRESHOLD_V = 80;

/** True when the equipment is recorded as providing it, or its listing names UL 1699B; undefined when not known. */
function providesArcFault(e: Equipment): boolean | undefined {
  if (e.kind !== "charge-controller" && !isInverter(e)) return false;
  if (e.providesPvArcFaultProtection !== undefined) return e.providesPvArcFaultProtection;
  return /1699B/i.test(e.listing) ? true : undefined;
}

export const pvArcFault: CheckDefinition = {
  id: "pv-arc-fault",
  title: "DC arc-fault protection",
  scopeTopic: "pv-arc-fault",
  formula: `maximum PV system voltage ≥ ${ARC_FAULT_THRESHOLD_V} V → a listed PV arc-fault circuit interrupter or equipment listed to provide it (UL 1699B)`,
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "pv-arc-fault");
    const out: CheckResult[] = [];
    for (const { item: array } of ctx.arrays.values()) {
      const t = new Trace();
      const d = arrayMaxVoltage(ctx, array.tag);
      t.merge(d);
      if (!d.ok) {
        out.push(needsInput(this, { subject: array.tag, inputs: t.inputs, missing: t.missing, reason: d.reason, codeRefs }));
        continue;
      }
      const vmax = d.value.maxVoltageV;
      const values = [v("maxVoltageV", "Maximum PV system voltage", vmax, "V"), v("thresholdV", "690.11 threshold", ARC_FAULT_THRESHOLD_V, "V")];
      const formula = `${d.formula}; ${vmax.toFixed(1)} V ${vmax >= ARC_FAULT_THRESHOLD_V ? "≥" : "<"} ${ARC_FAULT_THRESHOLD_V} V`;
      if (vmax < ARC_FAULT_THRESHOLD_V) {
        out.push(
          makeResult(this, {
            subject: array.tag,
            status: "pass",
            message: `${array.tag}: ${vmax.toFixed(1)} V at most, below the ${ARC_FAULT_THRESHOLD_V} V at which 690.11 calls for arc-fault protection.`,
            values,
            formula,
            inputs: t.inputs,
            codeRefs,
          }),
        );
        continue;
      }
      const feeds = arrayParts(ctx, array.tag)?.feeds as Indexed<Equipment> | undefined;
      if (!feeds) {
        t.need(`${ctx.arrays.get(array.tag)!.path}.feedsTag`, "Equipment the array feeds", undefined);
        out.push(needsInput(this, { subject: array.tag, values, inputs: t.inputs, missing: t.missing, codeRefs }));
        continue;
      }
      const path = `${feeds.path}.providesPvArcFaultProtection`;
      t.read(`${feeds.path}.listing`, `Listing of ${feeds.item.tag}`, feeds.item.listing || undefined);
      const provides = providesArcFault(feeds.item);
      t.read(path, `PV arc-fault protection in ${feeds.item.tag}`, provides);
      if (provides === undefined) {
        t.need(path, `PV arc-fault protection in ${feeds.item.tag}`, undefined);
        out.push(
          needsInput(this, {
            subject: array.tag,
            message: `${array.tag}: ${vmax.toFixed(1)} V needs arc-fault protection; record whether ${feeds.item.tag} is listed to provide it (UL 1699B).`,
            values,
            formula,
            inputs: t.inputs,
            missing: t.missing,
            codeRefs,
          }),
        );
        continue;
      }
      if (provides) {
        out.push(
          makeResult(this, {
            subject: array.tag,
            status: "pass",
            message: `${array.tag}: ${vmax.toFixed(1)} V, protected by the arc-fault detection of ${feeds.item.tag}.`,
            values,
            formula,
            inputs: t.inputs,
            codeRefs,
          }),
        );
        continue;
      }
      // 690.11 exception (2017 and later): circuits not in or on buildings, in metal raceway or underground.
      t.read("site.mounting", "Mounting", ctx.record.site.mounting);
      if (ctx.record.site.mounting === "ground") {
        out.push(
          makeResult(this, {
            subject: array.tag,
            status: "attest",
            message: `${array.tag}: ${vmax.toFixed(1)} V without arc-fault protection is allowed only where its circuits stay off and out of buildings and run in metal raceway, enclosed metal cable tray or underground (690.11 exception); confirm, or protect them.`,
            reason: "the ground-mount exception depends on the wiring method and route, which a person confirms",
            values,
            formula,
            inputs: t.inputs,
            codeRefs,
          }),
        );
        continue;
      }
      out.push(
        makeResult(this, {
          subject: array.tag,
          status: "fail",
          message: `${array.tag}: ${vmax.toFixed(1)} V, at or above ${ARC_FAULT_THRESHOLD_V} V, and ${feeds.item.tag} does not provide PV arc-fault protection.`,
          reason: `no listed PV arc-fault protection on a PV circuit at ${vmax.toFixed(1)} V`,
          remedy: remedy(
            `Use ${feeds.item.kind === "charge-controller" ? "a charge controller" : "an inverter"} listed to provide PV arc-fault protection (UL 1699B), or add a listed PV arc-fault circuit interrupter on the circuits of ${array.tag}.`,
          ),
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
