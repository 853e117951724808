/**
 * 22. Stand-alone output and back-fed breakers (710.15(B), 710.15(E), 408.36(D)).
 *
 * 710.15(B): the conductors between the stand-alone sources and the building's disconnect are sized on the sum of
 * the sources' output ratings — every inverter of a stacked set, every source landing on a combining panel — not
 * on one unit's rating. The sources are continuous, so the terminal-column ampacity carries 125 % of the sum
 * (215.2(A)(1)) and the ampacity under conditions of use carries the sum.
 *
 * 408.36(D) (710.15(E) for stand-alone inverters): a plug-in breaker fed from a source's output into a panel stays
 * live at its stabs when pulled, so it is held by a fastener that takes more than a pull to release. A source
 * listed as interactive only stops when it loses the bus, so its breaker may omit the fastener (705.12).
 */
import { CONDUCTOR_SIZES, type Circuit, type Equipment } from "../../schemas/project-record";
import { compareConductorSize } from "../tables";
import { isInverter, round, sizeLabel, Trace, v, type CheckContext, type EquipmentOf, type Indexed } from "../context";
import { conductorAmpacity, conductorAmpacityWithSize, type ConductorAmpacity } from "../derive/conductor";
import { remedy } from "../derive/remedy";
import { sourceOutputA, sourceRatings, type SourceRating } from "../derive/sources";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

type Breaker = EquipmentOf<"breaker">;

const SOURCE_CIRCUITS: readonly Circuit["kind"][] = ["inverter-ac-output", "generator-output"];
const CONTINUOUS = 1.25;

function isSourceEquipment(e: Equipment): boolean {
  return isInverter(e) || e.kind === "generator";
}

/** Terminal-column and conditions-of-use ampacity, with the parallel sets. */
function carries(a: ConductorAmpacity): { terminalA: number | undefined; correctedA: number | undefined } {
  const terminalA = a.tableAtTerminalA !== undefined ? a.tableAtTerminalA * a.sets : undefined;
  const correctedA = a.tableAtInsulationA !== undefined && a.correction !== undefined ? a.tableAtInsulationA * a.correction * a.adjustment * a.sets : undefined;
  return { terminalA, correctedA };
}

function sized(a: ConductorAmpacity, sumA: number): boolean {
  const { terminalA, correctedA } = carries(a);
  return terminalA !== undefined && correctedA !== undefined && terminalA >= CONTINUOUS * sumA && correctedA >= sumA;
}

function outputConductors(def: CheckDefinition, ctx: CheckContext): CheckResult[] {
  if (ctx.record.systemKind === "hybrid") return [];
  const out: CheckResult[] = [];
  const codeRefs = refs(ctx.edition, "stand-alone-output", "feeder-conductors");
  const seen = new Set<string>();
  for (const panel of ctx.record.equipment.filter((e) => e.kind === "ac-panel")) {
    const circuits = ctx.circuitsByEndpoint.get(panel.tag) ?? [];
    const sourceCircuits = circuits.filter((c) => SOURCE_CIRCUITS.includes(c.item.kind));
    if (sourceCircuits.length === 0) continue;
    // Each source circuit carries its own source (all units of a stacked set); a feeder onward carries them all.
    const carried: { ci: Indexed<Circuit>; sources: () => { t: Trace; list: SourceRating[] | undefined } }[] = [];
    for (const ci of sourceCircuits) {
      carried.push({
        ci,
        sources: () => {
          const t = new Trace();
          const src = ctx.equipment.get(ci.item.fromTag === panel.tag ? ci.item.toTag : ci.item.fromTag);
          if (!src || !isSourceEquipment(src.item)) return { t, list: [] };
          const a = sourceOutputA(src, t);
          return { t, list: a === undefined ? undefined : [{ tag: src.item.tag, currentA: a }] };
        },
      });
    }
    for (const ci of circuits) {
      if (SOURCE_CIRCUITS.includes(ci.item.kind)) continue;
      const other = ctx.equipment.get(ci.item.fromTag === panel.tag ? ci.item.toTag : ci.item.fromTag);
      // A feeder onward to another panel or to the building's disconnect.
      if (other?.item.kind !== "ac-panel" && other?.item.kind !== "disconnect") continue;
      carried.push({
        ci,
        sources: () => {
          const t = new Trace();
          return { t, list: sourceRatings(ctx, panel.tag, t) };
        },
      });
    }
    for (const { ci, sources } of carried) {
      if (seen.has(ci.item.tag)) continue;
      seen.add(ci.item.tag);
      const { t, list } = sources();
      if (list !== undefined && list.length === 0) continue;
      const amp = conductorAmpacity(ctx, ci);
      t.merge(amp);
      if (list === undefined || !amp.ok) {
        out.push(needsInput(def, { subject: ci.item.tag, inputs: t.inputs, missing: t.missing, codeRefs }));
        continue;
      }
      const sumA = list.reduce((s, x) => s + x.currentA, 0);
      const a = amp.value;
      const { terminalA, correctedA } = carries(a);
      const ok = sized(a, sumA);
      const size = ci.item.size!;
      const sumText = `${list.map((s) => `${s.tag} ${round(s.currentA, 1)} A`).join(" + ")} = ${round(sumA, 1)} A`;
      const values = [
        v("sourcesSumA", "Sum of the sources' output ratings", sumA, "A"),
        v("requiredTerminalA", "125 % of the sum (terminal column)", CONTINUOUS * sumA, "A"),
        v("terminalA", `Ampacity at the ${a.terminalRatingC} °C terminal column`, terminalA ?? "none", terminalA === undefined ? "" : "A"),
        v("correctedA", "Ampacity under conditions of use", correctedA ?? "none", correctedA === undefined ? "" : "A"),
      ];
      out.push(
        makeResult(def, {
          subject: ci.item.tag,
          status: ok ? "pass" : "fail",
          message: ok
            ? `${ci.item.tag}: ${sizeLabel(size, ci.item.material)} carries the sources' ${round(sumA, 1)} A (${round(CONTINUOUS * sumA, 1)} A at the terminals).`
            : `${ci.item.tag}: ${sizeLabel(size, ci.item.material)} is sized below the sum of the sources it carries, ${sumText} (${round(CONTINUOUS * sumA, 1)} A at the terminals).`,
          ...(ok ? {} : { reason: `conductors below the sum of the stand-alone sources' output (710.15(B))` }),
          remedy: () => {
            const next = CONDUCTOR_SIZES.find((s) => {
              if (compareConductorSize(s, size) <= 0) return false;
              const d = conductorAmpacityWithSize(ctx, ci, s);
              return d.ok && sized(d.value, sumA);
            });
            return next
              ? remedy(`Use ${sizeLabel(next, ci.item.material)} for ${ci.item.tag}: it carries the ${round(sumA, 1)} A sum of the sources, ${round(CONTINUOUS * sumA, 1)} A at the terminals.`, { path: `${ci.path}.size`, value: next })
              : remedy(`Run ${ci.item.tag} in parallel sets or a larger conductor that carries ${round(CONTINUOUS * sumA, 1)} A at the terminals.`);
          },
          values,
          formula: `Σ source output ratings ${sumText}; terminal column ${terminalA ?? "—"} A ≥ 1.25 × ${round(sumA, 2)} = ${round(CONTINUOUS * sumA, 2)} A, and ${correctedA !== undefined ? round(correctedA, 2) : "—"} A under conditions of use ≥ ${round(sumA, 2)} A`,
          inputs: t.inputs,
          codeRefs,
        }),
      );
    }
  }
  return out;
}

/** Breakers through which a source's output lands on a panel: the overcurrent device or a disconnect of that circuit. */
function backfedBreakers(ctx: CheckContext): { breaker: Indexed<Breaker>; circuit: Indexed<Circuit>; source: Indexed<Equipment> | undefined }[] {
  const out: { breaker: Indexed<Breaker>; circuit: Indexed<Circuit>; source: Indexed<Equipment> | undefined }[] = [];
  const seen = new Set<string>();
  for (const ci of ctx.circuits) {
    if (!SOURCE_CIRCUITS.includes(ci.item.kind)) continue;
    const ends = [ctx.equipment.get(ci.item.fromTag), ctx.equipment.get(ci.item.toTag)];
    const panel = ends.find((e) => e?.item.kind === "ac-panel");
    if (!panel) continue;
    const source = ends.find((e) => e && isSourceEquipment(e.item));
    for (const tag of [...(ci.item.ocpdTag ? [ci.item.ocpdTag] : []), ...ci.item.disconnectTags]) {
      const b = ctx.equipment.get(tag);
      if (!b || b.item.kind !== "breaker" || seen.has(tag)) continue;
      seen.add(tag);
      out.push({ breaker: b as Indexed<Breaker>, circuit: ci, source });
    }
  }
  return out;
}

function holdDowns(def: CheckDefinition, ctx: CheckContext): CheckResult[] {
  const out: CheckResult[] = [];
  const standAlone = ctx.record.systemKind !== "hybrid";
  const codeRefs = refs(ctx.edition, "backfed-holddown", ...(standAlone ? (["backfed-breaker"] as const) : []));
  for (const { breaker, circuit, source } of backfedBreakers(ctx)) {
    const t = new Trace();
    const b = breaker.item;
    const where = `${b.tag} (${circuit.item.tag} from ${source?.item.tag ?? "its source"})`;
    if (source && isInverter(source.item)) {
      const mode = t.read(`${source.path}.listedMode`, `Mode ${source.item.tag} is listed for`, source.item.listedMode);
      if (mode === "interactive") {
        out.push(
          makeResult(def, {
            subject: b.tag,
            status: "pass",
            message: `${where}: fed by an inverter listed as interactive only, which stops when it loses the bus; the fastener may be omitted.`,
            formula: "back-fed from a listed interactive inverter → no hold-down required",
            inputs: t.inputs,
            codeRefs: [...codeRefs, ...refs(ctx.edition, "interactive-backfed")],
          }),
        );
        continue;
      }
    }
    const mounting = t.need(`${breaker.path}.breakerMounting`, `Mounting of ${b.tag}`, b.breakerMounting);
    const formula = "plug-in breaker back-fed from a source → secured by a fastener that takes more than a pull to release; bolt-on breakers are held by their mounting";
    if (mounting === undefined) {
      out.push(needsInput(def, { subject: b.tag, message: `${where} is back-fed: record whether it is a plug-in or bolt-on breaker.`, inputs: t.inputs, missing: t.missing, codeRefs }));
      continue;
    }
    if (mounting === "bolt-on") {
      out.push(makeResult(def, { subject: b.tag, status: "pass", message: `${where}: back-fed, bolted to the bus.`, formula, inputs: t.inputs, codeRefs }));
      continue;
    }
    const held = t.need(`${breaker.path}.hasHoldDown`, `Hold-down fastener on ${b.tag}`, b.hasHoldDown);
    if (held === undefined) {
      out.push(needsInput(def, { subject: b.tag, message: `${where} is a back-fed plug-in breaker: record whether a hold-down fastener secures it.`, inputs: t.inputs, missing: t.missing, codeRefs }));
      continue;
    }
    out.push(
      makeResult(def, {
        subject: b.tag,
        status: held ? "pass" : "fail",
        message: held ? `${where}: back-fed plug-in breaker, secured by a hold-down fastener.` : `${where}: a back-fed plug-in breaker without a hold-down fastener stays live at its stabs when pulled.`,
        ...(held ? {} : { reason: "back-fed plug-in breaker not secured (408.36(D))" }),
        remedy: remedy(`Secure ${b.tag} with the panel maker's listed hold-down kit (a fastener that takes more than a pull to release).`, { path: `${breaker.path}.hasHoldDown`, value: true }),
        values: [v("backfed", "Back-fed from a source", true, "")],
        formula,
        inputs: t.inputs,
        codeRefs,
      }),
    );
  }
  return out;
}

export const standAloneOutput: CheckDefinition = {
  id: "stand-alone-output",
  title: "Stand-alone output and back-fed breakers",
  scopeTopic: "stand-alone-output",
  formula:
    "conductors from the stand-alone sources to the building disconnect carry the sum of the sources' output ratings (125 % at the terminals); back-fed plug-in breakers are held down",
  run(ctx: CheckContext): CheckResult[] {
    return [...outputConductors(this, ctx), ...holdDowns(this, ctx)];
  },
};
