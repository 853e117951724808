/**
 * 5. Overcurrent protection (690.9, 240.4, 240.6(A)): the device carries
 * 125 % of the continuous current, protects the conductor (240.4(B), 240.4(D)),
 * and parallel strings that could back-feed a faulted string beyond the
 * module's series fuse rating are fused.
 */
import { nextStandardOcpdRatingA, smallConductorMaxOcpdA, standardOcpdRatingsA } from "../tables";
import type { Circuit } from "../../schemas/project-record";
import { circuitArrayTag, isPvCircuit, sizeLabel, Trace, v, type CheckContext, type Indexed } from "../context";
import { circuitCurrent } from "../derive/circuit-current";
import { conductorAmpacity } from "../derive/conductor";
import { arrayIsc, arrayParts } from "../derive/pv";
import { maxProtectiveRatingA } from "../derive/remedy";
import { missingDeviceRemedy, ocpdRemedy, stringFuseRemedy } from "../derive/ocpd-remedy";
import { localRef, refs, storageRefs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";
import { CIRCUIT_KIND_WORDS, withArticle } from "../../schemas/vocabulary";

/**
 * The module's maximum series fuse rating where the circuit's device protects a string: every PV source circuit,
 * and a PV output circuit that carries a single string. "missing" when the rating is needed and not recorded.
 */
function moduleSeriesFuseLimit(ctx: CheckContext, ci: Indexed<Circuit>, t: Trace): number | "missing" | undefined {
  const arrayTag = circuitArrayTag(ctx, ci.item);
  const parts = arrayTag !== undefined ? arrayParts(ctx, arrayTag) : undefined;
  if (!parts?.module) return undefined;
  if (ci.item.kind === "pv-output" && parts.array.item.stringsInParallel > 1) return undefined;
  const m = parts.module;
  return t.need(`${m.path}.maxSeriesFuseA`, `Maximum series fuse of ${m.item.tag}`, m.item.maxSeriesFuseA, "A") ?? "missing";
}

export const overcurrentProtection: CheckDefinition = {
  id: "overcurrent-protection",
  title: "Overcurrent protection",
  scopeTopic: "pv-ocpd",
  formula:
    "1.25 × continuous current ≤ device rating ≤ conductor ampacity (next standard size up, 240.4(B); small-conductor limits, 240.4(D))",
  run(ctx: CheckContext): CheckResult[] {
    const ed = ctx.edition;
    const out: CheckResult[] = [];
    for (const ci of ctx.circuits) {
      const c = ci.item;
      const pv = isPvCircuit(c);
      const codeRefs = [
        ...(pv ? refs(ed, "pv-ocpd") : []),
        ...(c.kind === "battery" ? [...storageRefs(ctx, "ess-ocpd"), localRef(ed, "battery-conductor-ocpd")] : []),
        ...(c.kind === "generator-output" ? [localRef(ed, "generator-ocpd")] : []),
        ...(c.kind === "ac-branch" ? [localRef(ed, "branch-ocpd")] : []),
        ...refs(ed, "standard-ratings"),
        localRef(ed, "next-size-up"),
        ...refs(ed, "small-conductor"),
      ];
      const t = new Trace();
      const cur = circuitCurrent(ctx, ci);
      const amp = conductorAmpacity(ctx, ci);
      t.merge(cur);
      if (!cur.ok) {
        out.push(needsInput(this, { subject: c.tag, inputs: t.inputs, missing: t.missing, reason: cur.reason, codeRefs }));
        continue;
      }
      const I = cur.value.currentA;
      // Generators protect their own output (445.12); the device need only carry the nameplate current.
      const factor = c.kind === "generator-output" ? 1 : 1.25;
      const minA = I * factor;
      const minStandardA = nextStandardOcpdRatingA(minA);
      const ocpdTag = t.read(`${ci.path}.ocpdTag`, "Overcurrent device", c.ocpdTag);
      const dev = ocpdTag !== undefined ? ctx.equipment.get(ocpdTag) : undefined;

      if (!dev) {
        if (pv) {
          const arrayTag = c.arrayTag ?? (ctx.arrays.has(c.fromTag) ? c.fromTag : c.toTag);
          const isc = arrayIsc(ctx, arrayTag);
          t.merge(isc);
          const strings = isc.ok ? isc.value.strings : 1;
          // 690.9(A) exception: with two strings or fewer no parallel source can push more than one string's current back through another.
          const faultFromOthersA = isc.ok ? 1.25 * isc.value.iscA * Math.max(0, strings - 1) : 0;
          const parts = arrayParts(ctx, arrayTag);
          const fuse = parts?.module ? t.read(`${parts.module.path}.maxSeriesFuseA`, "Module maximum series fuse", parts.module.item.maxSeriesFuseA, "A") : undefined;
          const allowed = amp.ok ? amp.value.allowedA : undefined;
          const values = [v("faultFromOtherStringsA", "Fault current from the other strings", faultFromOthersA, "A")];
          if (fuse !== undefined) values.push(v("maxSeriesFuseA", "Module maximum series fuse", fuse, "A"));
          // Strings paralleled into this output circuit need their own fuses where the others can back-feed a fault beyond the series fuse rating.
          if (c.kind === "pv-output" && strings > 2 && isc.ok && fuse !== undefined && faultFromOthersA > fuse) {
            const sources = (ctx.circuitsByArray.get(arrayTag) ?? []).filter((x) => x.item.kind === "pv-source");
            const unfused = sources.length === 0 || sources.some((x) => x.item.ocpdTag === undefined);
            if (unfused) {
              out.push(
                makeResult(this, {
                  subject: c.tag,
                  status: "fail",
                  message: `${c.tag}: ${strings} strings of ${arrayTag} are paralleled and can feed ${faultFromOthersA.toFixed(1)} A into a faulted string, above the module's ${fuse} A series fuse rating; fuse each string${sources.length === 0 ? " (record the PV source circuits with their fuses)" : ""}.`,
                  reason: "string fuses required on the source circuits",
                  remedy: () => stringFuseRemedy(ctx, arrayTag, isc.value.iscA, fuse),
                  values,
                  formula: `1.25 × Isc × (${strings} − 1) = ${faultFromOthersA.toFixed(1)} A vs ${fuse} A`,
                  inputs: t.inputs,
                  codeRefs: [...codeRefs, ...refs(ed, "string-fuse")],
                }),
              );
              continue;
            }
          }
          // 690.9(A) exception (b): no device only where the module's series fuse rating, as well as the conductor, carries what the other strings can feed.
          if (strings >= 2 && fuse === undefined) {
            t.need(`${parts!.module!.path}.maxSeriesFuseA`, "Module maximum series fuse", undefined, "A");
            out.push(
              needsInput(this, {
                subject: c.tag,
                message: `${c.tag}: ${strings} strings of ${arrayTag} are paralleled; the module's maximum series fuse rating decides whether each string needs a fuse.`,
                values,
                inputs: t.inputs,
                missing: t.missing,
                codeRefs: [...codeRefs, ...refs(ed, "string-fuse")],
              }),
            );
            continue;
          }
          if (c.kind === "pv-output" || strings <= 1) {
            out.push(
              makeResult(this, {
                subject: c.tag,
                status: "pass",
                message:
                  c.kind === "pv-output"
                    ? `${c.tag}: no overcurrent device needed — the conductor is sized for the whole array's current and no other source feeds it (690.9(A) exception).`
                    : `${c.tag}: no overcurrent device needed — a single string cannot be back-fed by parallel strings (690.9(A) exception).`,
                values,
                formula: "fault current from the other strings = 1.25 × Isc × (strings − 1)",
                inputs: t.inputs,
                codeRefs: [...codeRefs, ...refs(ed, "string-fuse")],
              }),
            );
            continue;
          }
          if (fuse === undefined) {
            t.need(`${parts!.module!.path}.maxSeriesFuseA`, "Module maximum series fuse", undefined, "A");
            out.push(needsInput(this, { subject: c.tag, values, inputs: t.inputs, missing: t.missing, codeRefs: [...codeRefs, ...refs(ed, "string-fuse")] }));
            continue;
          }
          const ok = faultFromOthersA <= fuse && (allowed === undefined || faultFromOthersA <= allowed);
          out.push(
            makeResult(this, {
              subject: c.tag,
              status: ok ? "pass" : "fail",
              message: ok
                ? `${c.tag}: no string fuse needed — ${faultFromOthersA.toFixed(1)} A from the other strings is within the module's ${fuse} A series fuse rating.`
                : `${c.tag}: string fuses required — ${strings} strings in parallel can feed ${faultFromOthersA.toFixed(1)} A into a faulted string, above the module's ${fuse} A series fuse rating.`,
              ...(ok ? {} : { reason: `no overcurrent device on a string that parallel strings can back-feed beyond ${fuse} A` }),
              remedy: () => stringFuseRemedy(ctx, arrayTag, isc.ok ? isc.value.iscA : 0, fuse),
              values,
              formula: `1.25 × Isc × (${strings} − 1) = ${faultFromOthersA.toFixed(1)} A vs ${fuse} A`,
              inputs: t.inputs,
              codeRefs: [...codeRefs, ...refs(ed, "string-fuse")],
            }),
          );
          continue;
        }
        // Equipment with overcurrent devices built in protects the circuit it feeds.
        const builtIn = [c.fromTag].map((tag) => ctx.equipment.get(tag)).find((e) => e && "hasOvercurrentProtection" in e.item && e.item.hasOvercurrentProtection);
        const gen = ctx.equipment.get(c.fromTag)?.item;
        if (builtIn || (c.kind === "generator-output" && gen?.kind === "generator" && gen.outputBreakerA !== undefined)) {
          out.push(
            makeResult(this, {
              subject: c.tag,
              status: "attest",
              message: `${c.tag}: protected by the overcurrent device built into ${c.fromTag}; confirm its rating on the datasheet (at least ${minA.toFixed(1)} A, at most the conductor's ampacity).`,
              reason: "the built-in device's rating is not checked against the conductor",
              values: [v("minimumA", "Minimum device rating", minA, "A")],
              formula: `${factor} × ${I.toFixed(2)} A`,
              inputs: t.inputs,
              codeRefs,
            }),
          );
          continue;
        }
        out.push(
          makeResult(this, {
            subject: c.tag,
            status: "fail",
            message: `${c.tag}: no overcurrent device named; ${withArticle(CIRCUIT_KIND_WORDS[c.kind])} circuit needs one (at least ${minStandardA ?? minA.toFixed(0)} A).`,
            reason: `no overcurrent device recorded in ${ci.path}.ocpdTag`,
            remedy: () => missingDeviceRemedy(ctx, ci, minA),
            values: [v("minimumA", "Minimum device rating", minA, "A")],
            formula: `${factor} × ${I.toFixed(2)} A = ${minA.toFixed(2)} A → next standard rating ${minStandardA ?? "—"} A`,
            inputs: t.inputs,
            missing: [`${ci.path}.ocpdTag`],
            codeRefs,
          }),
        );
        continue;
      }

      const e = dev.item;
      const rating = e.kind === "fuse" || e.kind === "breaker" || e.kind === "disconnect" ? t.need(`${dev.path}.ratingA`, `Rating of ${e.tag}`, e.ratingA, "A") : undefined;
      t.merge(amp);
      if (rating === undefined || !amp.ok) {
        out.push(needsInput(this, { subject: c.tag, inputs: t.inputs, missing: t.missing, codeRefs, ...(amp.ok ? {} : { reason: amp.reason }) }));
        continue;
      }
      const problems: string[] = [];
      const warnings: string[] = [];
      if (rating < minA) problems.push(`${e.tag} at ${rating} A is below ${factor * 100} % of the ${I.toFixed(1)} A circuit current (${minA.toFixed(1)} A)`);
      const allowed = amp.value.allowedA;
      const size = c.size!;
      const small = smallConductorMaxOcpdA(c.material, size);
      const maxByAmpacity = allowed !== undefined ? maxProtectiveRatingA(allowed) : undefined;
      const values = [
        v("currentA", "Circuit current", I, "A"),
        v("minimumA", `${factor * 100} % of the circuit current`, minA, "A"),
        v("ratingA", `Rating of ${e.tag}`, rating, "A"),
        v("allowedAmpacityA", "Conductor ampacity under conditions of use", allowed ?? "none", allowed === undefined ? "" : "A"),
        v("maxByAmpacityA", "Largest device the ampacity allows (240.4(B))", maxByAmpacity ?? "none", maxByAmpacity === undefined ? "" : "A"),
      ];
      if (small !== undefined) values.push(v("smallConductorMaxA", `240.4(D) limit for ${size} AWG ${c.material}`, small, "A"));
      if (small !== undefined && rating > small) {
        problems.push(`${e.tag} is ${rating} A, but ${size} AWG ${c.material === "cu" ? "copper" : "aluminium"} may be protected at no more than ${small} A (240.4(D))`);
      }
      if (maxByAmpacity !== undefined && rating > maxByAmpacity) {
        problems.push(`${rating} A is above the ${allowed!.toFixed(1)} A the ${sizeLabel(size, c.material)} conductors carry (largest device ${maxByAmpacity} A, 240.4(B))`);
      }
      if (maxByAmpacity === undefined) problems.push(`the conductor has no usable ampacity to protect`);
      // A device on a string also protects its modules: it may not exceed the module's listed series fuse rating (110.3(B), 690.9).
      const seriesFuse = pv ? moduleSeriesFuseLimit(ctx, ci, t) : undefined;
      // A fail found already stands; otherwise the missing rating keeps the result from passing.
      if (seriesFuse === "missing" && problems.length === 0) {
        out.push(needsInput(this, { subject: c.tag, values, inputs: t.inputs, missing: t.missing, codeRefs: [...codeRefs, ...refs(ed, "string-fuse", "listing-use")] }));
        continue;
      }
      if (typeof seriesFuse === "number") {
        values.push(v("maxSeriesFuseA", "Module maximum series fuse", seriesFuse, "A"));
        codeRefs.push(...refs(ed, "string-fuse", "listing-use"));
        if (rating > seriesFuse) problems.push(`${e.tag} at ${rating} A is above the module's ${seriesFuse} A maximum series fuse rating (module listing, 110.3(B), 690.9)`);
      }
      const kind = e.kind === "fuse" ? "fuse" : "breaker";
      if (!standardOcpdRatingsA(ed, kind).includes(rating)) warnings.push(`${rating} A is not a standard rating of 240.6(A)`);
      const status = problems.length ? "fail" : warnings.length ? "warning" : "pass";
      out.push(
        makeResult(this, {
          subject: c.tag,
          status,
          message:
            status === "pass"
              ? `${c.tag}: ${e.tag} ${rating} A covers ${minA.toFixed(1)} A and protects the conductor (up to ${maxByAmpacity} A).`
              : `${c.tag}: ${[...problems, ...warnings].join("; ")}.`,
          ...(status === "pass" ? {} : { reason: [...problems, ...warnings].join("; ") }),
          remedy: () => ocpdRemedy(ctx, ci, dev, kind, rating, minA, typeof seriesFuse === "number" ? seriesFuse : undefined),
          values,
          formula: `${minA.toFixed(2)} A ≤ ${rating} A ≤ min(240.4(B) ${maxByAmpacity ?? "—"} A${small !== undefined ? `, 240.4(D) ${small} A` : ""}${typeof seriesFuse === "number" ? `, module series fuse ${seriesFuse} A` : ""})`,
          inputs: t.inputs,
          codeRefs,
        }),
      );
    }
    return out;
  },
};
