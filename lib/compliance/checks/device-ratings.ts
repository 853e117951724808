/**
 * 16. Device ratings and listings (110.3(B), 110.9, 690.4(B), 706.5): DC
 * devices DC-rated at or above the circuit's maximum voltage; battery
 * overcurrent devices interrupting the battery's fault current and standing
 * close to it; inverters listed for the mode they run in; storage listed.
 */
import type { Circuit } from "../../schemas/project-record";
import { circuitArrayTag, isDcCircuit, isInverter, isPvCircuit, Trace, v, type CheckContext, type Indexed, isProtective } from "../context";
import { arrayMaxVoltage } from "../derive/pv";
import { batteries } from "../derive/battery";
import { circuitCurrent } from "../derive/circuit-current";
import { remedy } from "../derive/remedy";
import { localRef, refs, storageRefs } from "../refs";
import { makeResult, needsInput, worst, type CheckDefinition } from "../result";
import type { CheckResult, CheckStatus } from "../types";

/** Farthest a battery's overcurrent device should stand from its terminals without comment, ft (common practice for "as close as practicable"). */
export const BATTERY_OCPD_NEAR_FT = 5;

export const deviceRatings: CheckDefinition = {
  id: "device-ratings",
  title: "Device ratings and listings",
  scopeTopic: "listing-use",
  formula:
    "DC-rated devices at or above the circuit's maximum voltage; interrupting rating ≥ available fault current; listed for the use",
  run(ctx: CheckContext): CheckResult[] {
    const ed = ctx.edition;
    const out: CheckResult[] = [];
    const bats = batteries(ctx);
    const batteryTags = new Set(bats.map((b) => b.item.tag));
    const faultA = bats.reduce<number | undefined>((sum, b) => (b.item.shortCircuitCurrentA === undefined || sum === undefined ? undefined : sum + b.item.shortCircuitCurrentA * b.item.quantity), bats.length ? 0 : undefined);

    const touchesBattery = (c: Circuit) => {
      for (const tag of [c.fromTag, c.toTag]) {
        if (batteryTags.has(tag)) return true;
      }
      return false;
    };

    for (const [tag, circuits] of ctx.circuitsByDevice) {
      const dev = ctx.equipment.get(tag);
      if (!dev || !isProtective(dev.item)) continue;
      const e = dev.item;
      const t = new Trace();
      const statuses: CheckStatus[] = ["pass"];
      const problems: string[] = [];
      /** What replaces the device, one line per problem, with the figure the replacement must reach. */
      const fixes: string[] = [];
      const values = [];
      const codeRefs = refs(ed, "listing-use", "interrupting-rating");
      const type = t.need(`${dev.path}.currentType`, `AC/DC rating of ${tag}`, e.currentType);
      const rating = t.need(`${dev.path}.voltageRatingV`, `Voltage rating of ${tag}`, e.voltageRatingV, "V");
      let maxV = 0;
      let anyDc = false;
      let anyAc = false;
      const onBattery: Indexed<Circuit>[] = [];
      for (const c of circuits) {
        const cur = circuitCurrent(ctx, c);
        const dc = isDcCircuit(c.item);
        anyDc ||= dc;
        anyAc ||= !dc;
        if (cur.ok && cur.value.maxVoltageV !== undefined) maxV = Math.max(maxV, cur.value.maxVoltageV);
        else if (cur.ok && isPvCircuit(c.item)) {
          // A PV circuit's voltage is the array's cold Voc: name what that computation lacks, not the circuit's nominal voltage it never reads.
          const arrayTag = circuitArrayTag(ctx, c.item);
          if (arrayTag !== undefined) t.merge(arrayMaxVoltage(ctx, arrayTag));
        } else if (cur.ok) t.need(`${c.path}.nominalVoltageV`, `Voltage of ${c.item.tag}`, undefined, "V");
        else t.merge(cur);
        if (dc && !["pv-source", "pv-output"].includes(c.item.kind) && bats.length) onBattery.push(c);
      }
      if (type === "ac" && anyDc) {
        statuses.push("fail");
        problems.push(`${tag} is rated for AC only but sits on DC circuit${circuits.length > 1 ? "s" : ""} ${circuits.filter((c) => isDcCircuit(c.item)).map((c) => c.item.tag).join(", ")}; DC arcs need a DC-rated device`);
        if (circuits.some((c) => c.item.kind === "pv-source" || c.item.kind === "pv-output")) codeRefs.push(...refs(ed, "pv-listing"));
        fixes.push(`a DC rating at ${maxV > 0 ? `${Math.ceil(maxV)} V` : "the circuit's voltage"} or more`);
      }
      if (type === "dc" && anyAc) {
        statuses.push("fail");
        problems.push(`${tag} is rated for DC only but sits on an AC circuit`);
        fixes.push("an AC rating");
      }
      if (rating !== undefined && maxV > 0) {
        values.push(v("voltageRatingV", `Voltage rating of ${tag}`, rating, "V"), v("circuitMaxV", "Highest circuit voltage", maxV, "V"));
        if (rating < maxV) {
          statuses.push("fail");
          problems.push(`${tag} is rated ${rating} V, below the circuit's ${maxV.toFixed(1)} V`);
          fixes.push(`a voltage rating of at least ${Math.ceil(maxV)} V`);
        }
      }
      const protectsBattery = (e.kind === "fuse" || e.kind === "breaker") && onBattery.length > 0;
      if (protectsBattery) {
        codeRefs.push(...storageRefs(ctx, "ess-ocpd"), localRef(ed, "battery-conductor-ocpd"));
        const ir = t.need(`${dev.path}.interruptingRatingA`, `Interrupting rating of ${tag}`, e.interruptingRatingA, "A");
        for (const b of bats) t.need(`${b.path}.shortCircuitCurrentA`, `Available short-circuit current of ${b.item.tag}`, b.item.shortCircuitCurrentA, "A");
        if (ir !== undefined && faultA !== undefined) {
          values.push(v("interruptingRatingA", `Interrupting rating of ${tag}`, ir, "A"), v("batteryFaultA", "Battery bank available fault current", faultA, "A"));
          if (ir < faultA) {
            statuses.push("fail");
            problems.push(`${tag} interrupts ${ir} A, below the battery bank's ${faultA} A available fault current (110.9)`);
            fixes.push(`an interrupting rating of at least ${faultA} A (for instance a class T fuse)`);
          }
        }
        if (onBattery.some((c) => touchesBattery(c.item)) || circuits.some((c) => touchesBattery(c.item))) {
          const dist = t.need(`${dev.path}.distanceFromBatteryFt`, `Distance of ${tag} from the battery`, e.distanceFromBatteryFt, "ft");
          if (dist !== undefined) {
            values.push(v("distanceFt", "Distance from the battery terminals", dist, "ft"));
            if (dist > BATTERY_OCPD_NEAR_FT) {
              statuses.push("warning");
              problems.push(`${tag} stands ${dist} ft from the battery; battery protection belongs as close as practicable to the terminals`);
              fixes.push(`a place within ${BATTERY_OCPD_NEAR_FT} ft of the battery terminals`);
            }
          }
        }
      }
      if (t.missing.length) statuses.push("needs-input");
      const status = worst(...statuses);
      if (status === "needs-input" && problems.length === 0) {
        out.push(needsInput(this, { subject: tag, inputs: t.inputs, missing: t.missing, values, codeRefs }));
        continue;
      }
      out.push(
        makeResult(this, {
          subject: tag,
          status,
          message: status === "pass" ? `${tag}: ${e.currentType?.toUpperCase()}-rated ${rating} V${protectsBattery ? `, interrupts ${e.interruptingRatingA} A` : ""} — suits ${circuits.map((c) => c.item.tag).join(", ")}.` : `${tag}: ${problems.join("; ")}.`,
          ...(status === "pass" ? {} : { reason: problems.join("; ") || `missing ${t.missing.join(", ")}` }),
          remedy: () => (fixes.length ? remedy(`Replace ${tag} with a device that has ${fixes.join(", ")}.`) : undefined),
          values,
          formula: `${anyDc ? "DC-rated, " : ""}voltage rating ≥ ${maxV ? maxV.toFixed(1) : "—"} V${protectsBattery ? `, interrupting rating ≥ ${faultA ?? "—"} A` : ""}`,
          inputs: t.inputs,
          missing: t.missing,
          codeRefs,
        }),
      );
    }

    const standAlone = ctx.record.systemKind !== "hybrid";
    ctx.record.equipment.forEach((e, i) => {
      const path = `equipment.${i}`;
      const t = new Trace();
      if (isInverter(e)) {
        const codeRefs = refs(ed, "listing-use", "pv-listing");
        const mode = t.need(`${path}.listedMode`, `Listed mode of ${e.tag}`, e.listedMode);
        const listing = t.need(`${path}.listing`, `Listing of ${e.tag}`, e.listing || undefined);
        if (mode === undefined || listing === undefined) {
          out.push(needsInput(this, { subject: e.tag, inputs: t.inputs, missing: t.missing, codeRefs }));
          return;
        }
        const okModes = standAlone ? ["stand-alone", "multimode"] : ["multimode", "interactive"];
        const ok = okModes.includes(mode);
        out.push(
          makeResult(this, {
            subject: e.tag,
            status: ok ? "pass" : "fail",
            message: ok
              ? `${e.tag}: listed (${listing}) for ${mode} operation, which suits a ${ctx.record.systemKind} system.`
              : `${e.tag}: listed for ${mode} operation, but a ${ctx.record.systemKind} system needs ${okModes.join(" or ")}.`,
            ...(ok ? {} : { reason: `an inverter listed ${mode} may not run ${standAlone ? "without the grid" : "interconnected"}` }),
            remedy: remedy(`Use an inverter listed for ${okModes.join(" or ")} operation (UL 1741), and record its listed mode.`),
            values: [v("listedMode", "Listed mode", mode, "")],
            inputs: t.inputs,
            codeRefs,
          }),
        );
      } else if (e.kind === "battery") {
        const codeRefs = storageRefs(ctx, "ess-listing");
        const listing = t.need(`${path}.listing`, `Listing of ${e.tag}`, e.listing || undefined);
        if (listing === undefined) {
          out.push(needsInput(this, { subject: e.tag, inputs: t.inputs, missing: t.missing, codeRefs }));
          return;
        }
        const ok = /9540(?!A)/i.test(listing);
        out.push(
          makeResult(this, {
            subject: e.tag,
            status: ok ? "pass" : "fail",
            message: ok ? `${e.tag}: storage listed (${listing}).` : `${e.tag}: storage is not recorded as listed as an energy storage system (UL 9540); recorded: ${listing}.`,
            ...(ok ? {} : { reason: "energy storage systems must be listed" }),
            remedy: remedy(`Use storage listed as an energy storage system to UL 9540, and record the listing.`),
            inputs: t.inputs,
            codeRefs,
          }),
        );
      } else if (e.kind === "pv-module" || e.kind === "charge-controller" || e.kind === "rapid-shutdown") {
        const codeRefs = refs(ed, "pv-listing");
        const listing = t.need(`${path}.listing`, `Listing of ${e.tag}`, e.listing || undefined);
        out.push(
          listing === undefined
            ? needsInput(this, { subject: e.tag, inputs: t.inputs, missing: t.missing, codeRefs })
            : makeResult(this, {
                subject: e.tag,
                status: "pass",
                message: `${e.tag}: listed (${listing}); install per the listing and instructions.`,
                inputs: t.inputs,
                codeRefs,
              }),
        );
      }
    });
    return out;
  },
};
