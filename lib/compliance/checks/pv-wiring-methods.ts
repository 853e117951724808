/**
 * PV wiring methods (690.31), per PV source or output circuit:
 *   - over 30 V in a readily accessible place, the conductors are guarded or in raceway or MC cable (690.31(A));
 *   - inside a building, PV DC circuits run in metal raceway or MC cable (or metal enclosures): 2017 690.31(G), from
 *     where they enter up to the first readily accessible disconnect; 2020/2023 690.31(D), where they exceed 30 V or
 *     8 A. A circuit whose entersBuilding is empty is read as entering one (the stricter reading, as 690.7 and 690.12);
 *   - those raceways and cables are marked (690.31(G)(3) / 690.31(D)(2)); the marking is on the label schedule.
 * The circuit's voltage is the array's maximum PV system voltage (690.7) and its current 125 % of Isc × the strings
 * it carries (690.8(A)(1)).
 */
import type { Circuit } from "../../schemas/project-record";
import { circuitArrayTag, isPvCircuit, Trace, v, type CheckContext, type Indexed } from "../context";
import { arrayIsc, arrayMaxVoltage } from "../derive/pv";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import { racewayType } from "../tables/wiring-types";
import type { CheckResult, Remedy } from "../types";

/** 690.31(A) and, from 2020, 690.31(D): the voltage above which the wiring method is regulated. */
export const PV_WIRING_VOLTAGE_THRESHOLD_V = 30;
/** 2020/2023 690.31(D): the current above which DC circuits inside a building are in metal (from memory). */
export const PV_WIRING_CURRENT_THRESHOLD_A = 8;
/** The raceway marking: at most every 10 ft, within 1 ft of turns and bends, above and below penetrations. */
export const RACEWAY_MARKING_SPACING_FT = 10;

interface Finding {
  status: "pass" | "fail";
  text: string;
  remedy?: Remedy;
}

/** Metal raceway or MC cable: what 690.31 accepts for DC circuits inside a building. */
function metallicMethod(code: string): boolean {
  const t = racewayType(code);
  return t !== undefined && t.metallic && (t.isRaceway || t.code === "MC");
}

/** Raceway of any kind, or MC cable: what 690.31(A) accepts in a readily accessible place. */
function enclosedMethod(code: string): boolean {
  const t = racewayType(code);
  return t !== undefined && (t.isRaceway || t.code === "MC");
}

export const pvWiringMethods: CheckDefinition = {
  id: "pv-wiring-methods",
  title: "PV wiring methods",
  scopeTopic: "pv-wiring-accessible",
  formula: `PV circuit over ${PV_WIRING_VOLTAGE_THRESHOLD_V} V in a readily accessible place → guarded, or in raceway or MC cable; inside a building → metal raceway or MC cable (from 2020, above ${PV_WIRING_VOLTAGE_THRESHOLD_V} V or ${PV_WIRING_CURRENT_THRESHOLD_A} A), marked at most every ${RACEWAY_MARKING_SPACING_FT} ft`,
  run(ctx: CheckContext): CheckResult[] {
    const out: CheckResult[] = [];
    for (const ci of ctx.circuits) if (isPvCircuit(ci.item)) out.push(checkCircuit(this, ctx, ci));
    return out;
  },
};

function checkCircuit(def: CheckDefinition, ctx: CheckContext, ci: Indexed<Circuit>): CheckResult {
  const c = ci.item;
  const ed = ctx.edition;
  const t = new Trace();
  const codeRefs = refs(ed, "pv-wiring-accessible");
  const arrayTag = circuitArrayTag(ctx, c);
  if (arrayTag === undefined) {
    t.need(`${ci.path}.arrayTag`, "Array the circuit carries", undefined);
    return needsInput(def, { subject: c.tag, inputs: t.inputs, missing: t.missing, codeRefs });
  }
  const vd = arrayMaxVoltage(ctx, arrayTag);
  t.merge(vd);
  if (!vd.ok) return needsInput(def, { subject: c.tag, inputs: t.inputs, missing: t.missing, reason: vd.reason, codeRefs });
  const vmax = vd.value.maxVoltageV;
  const overVoltage = vmax > PV_WIRING_VOLTAGE_THRESHOLD_V;
  const values = [v("maxVoltageV", "Maximum PV system voltage", vmax, "V"), v("thresholdV", "690.31 voltage threshold", PV_WIRING_VOLTAGE_THRESHOLD_V, "V")];
  const parts: string[] = [`${vmax.toFixed(1)} V ${overVoltage ? ">" : "≤"} ${PV_WIRING_VOLTAGE_THRESHOLD_V} V`];
  const findings: Finding[] = [];
  const method = c.racewayType;
  const methodLabel = racewayType(method)?.code ?? method;

  // 690.31(A): readily accessible circuits over 30 V.
  if (overVoltage) {
    const accessible = t.need(`${ci.path}.readilyAccessible`, `${c.tag} readily accessible`, c.readilyAccessible);
    if (accessible === true) {
      if (method === "") t.need(`${ci.path}.racewayType`, `Wiring method of ${c.tag}`, undefined);
      else {
        t.read(`${ci.path}.racewayType`, `Wiring method of ${c.tag}`, method);
        if (enclosedMethod(method)) findings.push({ status: "pass", text: `readily accessible, in ${methodLabel}` });
        else {
          const guarded = t.need(`${ci.path}.guarded`, `${c.tag} guarded`, c.guarded);
          if (guarded === true) findings.push({ status: "pass", text: "readily accessible and guarded" });
          else if (guarded === false) {
            findings.push({
              status: "fail",
              text: `readily accessible at ${vmax.toFixed(1)} V, ${methodLabel}, not guarded (690.31(A))`,
              remedy: remedy(`Run ${c.tag} in raceway or MC cable, or guard it where people can reach it: ${vmax.toFixed(1)} V is over ${PV_WIRING_VOLTAGE_THRESHOLD_V} V.`, {
                path: `${ci.path}.racewayType`,
                value: "EMT",
              }),
            });
          }
        }
      }
    } else if (accessible === false) findings.push({ status: "pass", text: "not readily accessible" });
  }

  // Inside a building: metal raceway or MC cable.
  t.read(`${ci.path}.entersBuilding`, `${c.tag} enters a building`, c.entersBuilding);
  let inside = c.entersBuilding !== false;
  if (inside && ed !== "2017" && !overVoltage) {
    // From 2020 the rule starts above 30 V or 8 A: 125 % of Isc × the strings carried (690.8(A)(1)).
    const id = arrayIsc(ctx, arrayTag);
    t.merge(id);
    if (id.ok) {
      const strings = c.stringsCarried ?? id.value.strings;
      const currentA = 1.25 * id.value.iscA * strings;
      values.push(v("maxCurrentA", "Maximum circuit current", Math.round(currentA * 100) / 100, "A"));
      parts.push(`${currentA.toFixed(2)} A ${currentA > PV_WIRING_CURRENT_THRESHOLD_A ? ">" : "≤"} ${PV_WIRING_CURRENT_THRESHOLD_A} A`);
      inside = currentA > PV_WIRING_CURRENT_THRESHOLD_A;
    }
  }
  if (inside) {
    codeRefs.push(...refs(ed, "pv-wiring-in-building", "raceway-marking"));
    if (method === "") t.need(`${ci.path}.racewayType`, `Wiring method of ${c.tag}`, undefined);
    else {
      t.read(`${ci.path}.racewayType`, `Wiring method of ${c.tag}`, method);
      const where = ed === "2017" ? "from where it enters the building to its first readily accessible disconnect" : "inside the building";
      if (metallicMethod(method)) {
        findings.push({
          status: "pass",
          text: `${where} in ${methodLabel}, marked "PHOTOVOLTAIC POWER SOURCE" at most every ${RACEWAY_MARKING_SPACING_FT} ft (label schedule)`,
        });
      } else {
        findings.push({
          status: "fail",
          text: `runs on or in a building in ${methodLabel}, not metal raceway or MC cable`,
          remedy: remedy(`Run ${c.tag} ${where} in metal raceway (EMT, RMC, IMC, FMC) or MC cable.`, { path: `${ci.path}.racewayType`, value: "EMT" }),
        });
      }
    }
  } else if (c.entersBuilding === false) findings.push({ status: "pass", text: "stays outside buildings" });

  if (!overVoltage && !inside) findings.push({ status: "pass", text: `at most ${PV_WIRING_VOLTAGE_THRESHOLD_V} V${ed !== "2017" ? ` and ${PV_WIRING_CURRENT_THRESHOLD_A} A` : ""}` });
  const formula = parts.join("; ");
  if (t.missing.length > 0) {
    return needsInput(def, { subject: c.tag, values, formula, inputs: t.inputs, missing: t.missing, codeRefs });
  }
  const fails = findings.filter((f) => f.status === "fail");
  if (fails.length > 0) {
    return makeResult(def, {
      subject: c.tag,
      status: "fail",
      message: `${c.tag}: ${fails.map((f) => f.text).join("; ")}.`,
      reason: fails.map((f) => f.text).join("; "),
      // The metal raceway that a building asks for also meets 690.31(A), so the last finding's remedy covers both.
      remedy: fails[fails.length - 1]!.remedy!,
      values,
      formula,
      inputs: t.inputs,
      codeRefs,
    });
  }
  return makeResult(def, {
    subject: c.tag,
    status: "pass",
    message: `${c.tag}: ${findings.map((f) => f.text).join("; ")}.`,
    values,
    formula,
    inputs: t.inputs,
    codeRefs,
  });
}
