/**
 * PV system grounding configuration (690.41(A)) and DC ground-fault protection (690.41(B)). The designer names the
 * configuration; every configuration needs listed DC ground-fault protection except a solidly grounded array with
 * no more than two PV source circuits whose DC circuits all stay off and out of buildings (690.41(B) Exception).
 * The protection is in the controller or inverter the array feeds, or in a listed device on the array's circuits.
 */
import type { Equipment, PvGroundingConfiguration } from "../../schemas/project-record";
import { isInverter, isProtective, Trace, v, type CheckContext, type Indexed } from "../context";
import { arrayParts } from "../derive/pv";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

/** 690.41(B) Exception: at most two PV source circuits, all DC circuits off buildings, solidly grounded. */
export const GFP_EXCEPTION_MAX_SOURCE_CIRCUITS = 2;

export const PV_GROUNDING_LABELS: Record<PvGroundingConfiguration, string> = {
  "two-wire-functional-ground": "2-wire array with one functional grounded conductor",
  "bipolar-functional-ground": "bipolar array with a functional ground reference (centre tap)",
  "not-isolated": "array not isolated from a grounded inverter output circuit",
  ungrounded: "ungrounded array",
  "solidly-grounded": "solidly grounded array",
  "other-listed": "other method with equipment listed and identified for the use",
};

/** Whether equipment provides PV ground-fault protection: true, false, or undefined when the record does not say. */
function providesGfp(e: Equipment): boolean | undefined {
  if (e.kind === "charge-controller" || isInverter(e) || isProtective(e)) return e.providesPvGroundFaultProtection;
  return false;
}

export const pvGrounding: CheckDefinition = {
  id: "pv-grounding",
  title: "PV system grounding and DC ground-fault protection",
  scopeTopic: "pv-ground-fault",
  formula:
    "a named 690.41(A) grounding configuration; listed DC ground-fault protection that detects faults in the array's conductors and isolates the faulted circuit (690.41(B)), unless solidly grounded with ≤ 2 PV source circuits and every PV DC circuit off buildings",
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "pv-grounding-configuration", "pv-ground-fault");
    const out: CheckResult[] = [];
    const config = ctx.record.pvGroundingConfiguration;
    for (const { item: array, path: arrayPath } of ctx.arrays.values()) {
      const t = new Trace();
      t.need("pvGroundingConfiguration", "PV system grounding configuration", config);
      if (config === undefined) {
        out.push(
          needsInput(this, {
            subject: array.tag,
            message: `${array.tag}: name the PV system grounding configuration (690.41(A)); it decides whether DC ground-fault protection is required.`,
            inputs: t.inputs,
            missing: t.missing,
            codeRefs,
          }),
        );
        continue;
      }
      const configValue = v("configuration", "Grounding configuration", PV_GROUNDING_LABELS[config]);
      const sourceCircuits = array.stringsInParallel;
      t.read(`${arrayPath}.stringsInParallel`, "Strings in parallel (PV source circuits)", sourceCircuits);

      if (config === "solidly-grounded") {
        const circuits = ctx.circuitsByArray.get(array.tag) ?? [];
        t.read("site.mounting", "Mounting", ctx.record.site.mounting);
        for (const c of circuits) t.read(`${c.path}.entersBuilding`, `${c.item.tag} enters a building`, c.item.entersBuilding);
        const unknown = circuits.filter((c) => c.item.entersBuilding === undefined);
        const offBuildings = ctx.record.site.mounting === "ground" && circuits.length > 0 && circuits.every((c) => c.item.entersBuilding === false);
        const values = [configValue, v("sourceCircuits", "PV source circuits", sourceCircuits), v("exceptionMax", "Exception limit", GFP_EXCEPTION_MAX_SOURCE_CIRCUITS)];
        const formula = `solidly grounded: ${sourceCircuits} source circuit${sourceCircuits === 1 ? "" : "s"} ${sourceCircuits <= GFP_EXCEPTION_MAX_SOURCE_CIRCUITS ? "≤" : ">"} ${GFP_EXCEPTION_MAX_SOURCE_CIRCUITS}; PV DC circuits ${offBuildings ? "all off buildings" : "on or in a building"}`;
        if (sourceCircuits <= GFP_EXCEPTION_MAX_SOURCE_CIRCUITS && ctx.record.site.mounting === "ground" && unknown.length > 0) {
          for (const c of unknown) t.need(`${c.path}.entersBuilding`, `${c.item.tag} enters a building`, undefined);
          out.push(
            needsInput(this, {
              subject: array.tag,
              message: `${array.tag}: a solidly grounded array goes without ground-fault protection only where its DC circuits stay off buildings; record whether ${unknown.map((c) => c.item.tag).join(", ")} enter${unknown.length === 1 ? "s" : ""} one.`,
              values,
              formula,
              inputs: t.inputs,
              missing: t.missing,
              codeRefs,
            }),
          );
          continue;
        }
        if (sourceCircuits <= GFP_EXCEPTION_MAX_SOURCE_CIRCUITS && offBuildings) {
          out.push(
            makeResult(this, {
              subject: array.tag,
              status: "pass",
              message: `${array.tag}: solidly grounded, ${sourceCircuits} PV source circuit${sourceCircuits === 1 ? "" : "s"} (at most ${GFP_EXCEPTION_MAX_SOURCE_CIRCUITS}) and every DC circuit off buildings, so 690.41(B) Exception allows it without ground-fault protection.`,
              values,
              formula,
              inputs: t.inputs,
              codeRefs,
            }),
          );
          continue;
        }
        const why =
          sourceCircuits > GFP_EXCEPTION_MAX_SOURCE_CIRCUITS
            ? `${sourceCircuits} PV source circuits, more than the ${GFP_EXCEPTION_MAX_SOURCE_CIRCUITS} the exception allows`
            : "its PV DC circuits run on or in a building";
        out.push(
          makeResult(this, {
            subject: array.tag,
            status: "fail",
            message: `${array.tag}: solidly grounded with ${why}; 690.41(A)(5) allows a solidly grounded array only under the 690.41(B) Exception.`,
            reason: `solidly grounded outside the 690.41(B) Exception (${why})`,
            remedy: remedy(
              `Use a functionally grounded or ungrounded configuration with listed DC ground-fault protection${sourceCircuits > GFP_EXCEPTION_MAX_SOURCE_CIRCUITS ? `, or keep it to ${GFP_EXCEPTION_MAX_SOURCE_CIRCUITS} source circuits off buildings` : ""}.`,
            ),
            values,
            formula,
            inputs: t.inputs,
            codeRefs,
          }),
        );
        continue;
      }

      // Every other configuration needs listed DC ground-fault protection (690.41(B)).
      const feeds = arrayParts(ctx, array.tag)?.feeds as Indexed<Equipment> | undefined;
      if (!feeds) {
        t.need(`${arrayPath}.feedsTag`, "Equipment the array feeds", undefined);
        out.push(needsInput(this, { subject: array.tag, values: [configValue], inputs: t.inputs, missing: t.missing, codeRefs }));
        continue;
      }
      const feedsPath = `${feeds.path}.providesPvGroundFaultProtection`;
      const inFeeds = providesGfp(feeds.item);
      t.read(feedsPath, `PV ground-fault protection in ${feeds.item.tag}`, inFeeds);
      // A listed ground-fault device on the array's circuits (its fuse, breaker or disconnects) serves as well.
      let device: Indexed<Equipment> | undefined;
      for (const c of ctx.circuitsByArray.get(array.tag) ?? []) {
        for (const tag of [c.item.ocpdTag, ...c.item.disconnectTags]) {
          const d = tag !== undefined ? ctx.equipment.get(tag) : undefined;
          if (!d || !isProtective(d.item) || device) continue;
          t.read(`${d.path}.providesPvGroundFaultProtection`, `PV ground-fault protection in ${d.item.tag}`, d.item.providesPvGroundFaultProtection);
          if (d.item.providesPvGroundFaultProtection === true) device = d;
        }
      }
      const by = inFeeds === true ? feeds : device;
      const formula = `${PV_GROUNDING_LABELS[config]} → listed DC ground-fault protection required; ${by ? `provided by ${by.item.tag}` : "none recorded"}`;
      if (by) {
        out.push(
          makeResult(this, {
            subject: array.tag,
            status: "pass",
            message: `${array.tag}: ${PV_GROUNDING_LABELS[config]}; DC ground-fault protection by ${by.item.tag}.`,
            values: [configValue, v("protectedBy", "Ground-fault protection", by.item.tag)],
            formula,
            inputs: t.inputs,
            codeRefs,
          }),
        );
        continue;
      }
      if (inFeeds === undefined) {
        t.need(feedsPath, `PV ground-fault protection in ${feeds.item.tag}`, undefined);
        out.push(
          needsInput(this, {
            subject: array.tag,
            message: `${array.tag}: record whether ${feeds.item.tag} is listed to provide PV DC ground-fault protection (690.41(B)).`,
            values: [configValue],
            formula,
            inputs: t.inputs,
            missing: t.missing,
            codeRefs,
          }),
        );
        continue;
      }
      out.push(
        makeResult(this, {
          subject: array.tag,
          status: "fail",
          message: `${array.tag}: ${PV_GROUNDING_LABELS[config]} with no listed DC ground-fault protection; ${feeds.item.tag} does not provide it and no device on the array's circuits does.`,
          reason: "no listed DC ground-fault protection on the PV array",
          remedy: remedy(
            `Use ${feeds.item.kind === "charge-controller" ? "a charge controller" : "an inverter"} listed for PV ground-fault protection, or add a listed PV ground-fault protection device on the circuits of ${array.tag} (690.41(B)).`,
          ),
          values: [configValue],
          formula,
          inputs: t.inputs,
          codeRefs,
        }),
      );
    }
    return out;
  },
};
