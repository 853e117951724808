/**
 * 23. Generator disconnects (445.18; 225.31 / 225.32 where a feeder enters another building).
 *
 * A generator is portable (cord-and-plug connected through a power inlet, UL 2201) or stationary (permanently
 * installed, UL 2200), as the designer states or its listing says. A portable generator plugged into an inlet is
 * disconnected by its plug, which 445.18(A) accepts; a stationary one, or a portable one wired in, has its own
 * lockable disconnect at the unit: one built in, or a disconnect or breaker recorded as standing at it.
 *
 * A circuit that leaves the structure its source stands in and enters another building needs a disconnect at that
 * building, nearest the point of entrance (225.31, 225.32; 225.31(A)/(B) from 2020). The record asks it of every
 * generator circuit; other AC circuits answer it when the designer says so.
 */
import type { Circuit } from "../../schemas/project-record";
import { equipmentOfKind, Trace, v, type CheckContext, type Indexed } from "../context";
import { generatorInstallation, type Generator } from "../derive/generator";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

const AC_KINDS: readonly Circuit["kind"][] = ["generator-output", "inverter-ac-output", "ac-branch"];

function generatorDisconnect(def: CheckDefinition, ctx: CheckContext, g: Indexed<Generator>): CheckResult {
  const t = new Trace();
  const codeRefs = refs(ctx.edition, "generator-disconnect-means");
  const installation = generatorInstallation(g, t);
  if (installation === undefined) {
    return needsInput(def, {
      subject: g.item.tag,
      message: `${g.item.tag}: record whether it is portable (cord and plug, UL 2201) or stationary (UL 2200); its listing does not say.`,
      inputs: t.inputs,
      missing: t.missing,
      codeRefs,
    });
  }
  const values = [v("installation", "Installation", installation, "")];
  if (installation === "portable") {
    const inlet = t.need(`${g.path}.connectedByInlet`, `${g.item.tag} connects through a power inlet`, g.item.connectedByInlet);
    if (inlet === undefined) {
      return needsInput(def, { subject: g.item.tag, message: `${g.item.tag} is portable: record whether it connects by cord and plug through a power inlet.`, values, inputs: t.inputs, missing: t.missing, codeRefs });
    }
    if (inlet) {
      return makeResult(def, {
        subject: g.item.tag,
        status: "pass",
        message: `${g.item.tag}: portable, cord-and-plug connected through a power inlet; the plug disconnects it (445.18(A)).`,
        values,
        formula: "portable generator by cord and plug through an inlet → the plug is its disconnecting means",
        inputs: t.inputs,
        codeRefs,
      });
    }
  }
  const builtIn = t.read(`${g.path}.hasOutputDisconnect`, `Output disconnect built into ${g.item.tag}`, g.item.hasOutputDisconnect);
  const atUnit = ctx.record.equipment.filter((e) => (e.kind === "disconnect" || e.kind === "breaker") && e.locatedAtTag === g.item.tag).map((e) => e.tag);
  ctx.record.equipment.forEach((e, i) => {
    if ((e.kind === "disconnect" || e.kind === "breaker") && e.locatedAtTag === g.item.tag) t.read(`equipment.${i}.locatedAtTag`, `${e.tag} stands at`, e.locatedAtTag);
  });
  const by = [...(builtIn ? [`the disconnect built into ${g.item.tag}`] : []), ...atUnit];
  const what = installation === "portable" ? "portable but wired in" : "stationary";
  const formula = `${what} → a lockable disconnect at the generator, opening every ungrounded conductor: built in, or a disconnect or breaker standing at it`;
  if (by.length) {
    return makeResult(def, { subject: g.item.tag, status: "pass", message: `${g.item.tag}: ${what}, disconnected at the unit by ${by.join(", ")}.`, values, formula, inputs: t.inputs, codeRefs });
  }
  return makeResult(def, {
    subject: g.item.tag,
    status: "fail",
    message: `${g.item.tag}: ${what}, with no disconnect at the generator.`,
    reason: "no disconnecting means at the generator (445.18(A))",
    remedy: remedy(`Add a lockable disconnect or breaker at ${g.item.tag} that opens all its ungrounded conductors, and record it as standing at ${g.item.tag} (or use a generator with an output disconnect built in).`),
    values,
    formula,
    inputs: t.inputs,
    codeRefs,
  });
}

function buildingDisconnect(def: CheckDefinition, ctx: CheckContext, ci: Indexed<Circuit>): CheckResult | undefined {
  const c = ci.item;
  const t = new Trace();
  const codeRefs = refs(ctx.edition, "building-disconnect", "building-disconnect-location");
  const asked = c.kind === "generator-output";
  const path = `${ci.path}.feedsOtherBuilding`;
  const label = `${c.tag} enters another building`;
  const enters = asked ? t.need(path, label, c.feedsOtherBuilding) : t.read(path, label, c.feedsOtherBuilding);
  if (enters === undefined) {
    if (!asked) return undefined;
    return needsInput(def, { subject: c.tag, message: `${c.tag}: record whether the generator's circuit leaves its structure and enters another building.`, inputs: t.inputs, missing: t.missing, codeRefs });
  }
  if (!enters) {
    return makeResult(def, {
      subject: c.tag,
      status: "not-applicable",
      message: `${c.tag} stays within the structure its source stands in (or runs to equipment outside any building).`,
      reason: "the circuit enters no other building",
      inputs: t.inputs,
      codeRefs,
    });
  }
  const tag = t.read(`${ci.path}.buildingDisconnectTag`, "Disconnect where it enters", c.buildingDisconnectTag);
  const formula = "a circuit entering another building → a disconnect for that building at a readily accessible place nearest the point of entrance";
  if (tag !== undefined) {
    return makeResult(def, { subject: c.tag, status: "pass", message: `${c.tag} enters another building through ${tag}, its disconnect nearest the point of entrance.`, formula, inputs: t.inputs, codeRefs });
  }
  return makeResult(def, {
    subject: c.tag,
    status: "fail",
    message: `${c.tag} enters another building with no disconnect named where it enters.`,
    reason: "no building disconnect (225.31)",
    remedy: remedy(`Add a disconnect (or a panel with a main) where ${c.tag} enters the building, readily accessible and nearest the point of entrance, and name it as the circuit's building disconnect.`),
    formula,
    inputs: t.inputs,
    codeRefs,
  });
}

export const generatorDisconnects: CheckDefinition = {
  id: "generator-disconnects",
  title: "Generator and building disconnects",
  scopeTopic: "generator-disconnect-means",
  formula:
    "portable by cord and plug through an inlet, or a lockable disconnect at the generator; a disconnect where a feeder enters another building",
  run(ctx: CheckContext): CheckResult[] {
    const out = equipmentOfKind(ctx, "generator").map((g) => generatorDisconnect(this, ctx, g));
    for (const ci of ctx.circuits) {
      if (!AC_KINDS.includes(ci.item.kind)) continue;
      const r = buildingDisconnect(this, ctx, ci);
      if (r) out.push(r);
    }
    return out;
  },
};
