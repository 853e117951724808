/**
 * 24. Grounding electrode system and the single neutral-to-ground bond (250.50, 250.66, 250.166, 690.47, 250.30,
 * 250.6, 250.35).
 *
 * The electrode system: the record names its electrodes and one grounding electrode conductor. That conductor
 * serves the DC system (250.166: not smaller than the largest DC conductor, at least 8 AWG Cu) and the AC system
 * the inverters and generators derive (Table 250.66, by the largest supply conductor), so it must meet the larger
 * of both; a conductor whose only connection is to rods, plates, a concrete-encased electrode or a ground ring
 * need not exceed that electrode's cap. Reading 250.166 for every DC system is the stricter case: a DC system of
 * 60 V or less need not be grounded at all (250.162, from memory), and a designer then records the GEC the AC side needs.
 *
 * The bond: neutral and ground join at exactly one point of the AC system. A second bond (an inverter's, a
 * generator's and a panel's each left in place) puts neutral current on the grounding conductors (250.6).
 */
import type { Circuit, ConductorSize, Equipment } from "../../schemas/project-record";
import { acGecSize, compareConductorSize, dcGecSize, equivalentCmil, gecCapFor } from "../tables";
import { equipmentOfKind, isDcCircuit, sizeLabel, Trace, v, type CheckContext, type Indexed } from "../context";
import { generatorInstallation } from "../derive/generator";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult, RemedyChange } from "../types";

const AC_SUPPLY_KINDS: readonly Circuit["kind"][] = ["inverter-ac-output", "generator-output"];

function larger(a: ConductorSize | undefined, b: ConductorSize | undefined): ConductorSize | undefined {
  if (a === undefined) return b;
  if (b === undefined) return a;
  return compareConductorSize(a, b) >= 0 ? a : b;
}

function electrodeSystem(def: CheckDefinition, ctx: CheckContext): CheckResult {
  const g = ctx.record.grounding;
  const t = new Trace();
  const dc = ctx.circuits.filter((c) => isDcCircuit(c.item));
  const ac = ctx.circuits.filter((c) => AC_SUPPLY_KINDS.includes(c.item.kind));
  const codeRefs = refs(ctx.edition, "electrode-system", ...(ctx.arrays.size ? (["pv-electrode"] as const) : []), ...(dc.length ? (["dc-gec"] as const) : []), ...(ac.length ? (["ac-gec-table"] as const) : []));
  t.read("grounding.electrodes", "Grounding electrodes", g.electrodes.length ? g.electrodes.join(", ") : undefined);
  if (g.electrodes.length === 0 && !t.missing.includes("grounding.electrodes")) t.missing.push("grounding.electrodes");
  const gec = t.need("grounding.gecSize", "Grounding electrode conductor size", g.gecSize, "AWG/kcmil");
  const material = g.gecMaterial;
  t.read("grounding.gecMaterial", "GEC material", material);

  // 250.166(B): the largest conductor the DC system supplies.
  let largestDc: ConductorSize | undefined;
  for (const c of dc) {
    const size = t.need(`${c.path}.size`, `Conductor size of ${c.item.tag}`, c.item.size, "AWG/kcmil");
    largestDc = larger(largestDc, size);
  }
  // Table 250.66: the largest AC supply conductor, parallel sets by their equivalent area.
  let largestAc: { cmil: number; material: "cu" | "al"; label: string } | undefined;
  for (const c of ac) {
    const size = t.need(`${c.path}.size`, `Conductor size of ${c.item.tag}`, c.item.size, "AWG/kcmil");
    if (size === undefined) continue;
    const cmil = equivalentCmil(size, c.item.parallelSets);
    if (!largestAc || cmil > largestAc.cmil) largestAc = { cmil, material: c.item.material, label: `${c.item.tag} ${c.item.parallelSets > 1 ? `${c.item.parallelSets} × ` : ""}${sizeLabel(size, c.item.material)}` };
  }
  if (t.missing.length || gec === undefined) {
    return needsInput(def, {
      subject: "electrode-system",
      message: `Needs input: ${t.missing.join(", ")} — the grounding electrode system and its conductor (250.50, ${dc.length ? "250.166" : "Table 250.66"}).`,
      inputs: t.inputs,
      missing: t.missing,
      codeRefs,
    });
  }
  const dcReq = largestDc !== undefined ? dcGecSize(largestDc, material) : undefined;
  const acReq = largestAc !== undefined ? acGecSize(largestAc.cmil, largestAc.material, material) : undefined;
  const uncapped = larger(dcReq, acReq) ?? (material === "cu" ? "8" : "6");
  const cap = gecCapFor(g.electrodes, material);
  const required = cap !== undefined && compareConductorSize(uncapped, cap) > 0 ? cap : uncapped;
  const ok = compareConductorSize(gec, required) >= 0;
  const values = [
    ...(dcReq ? [v("dcRequired", `250.166 for the largest DC conductor (${sizeLabel(largestDc!)})`, dcReq, "AWG/kcmil")] : []),
    ...(acReq ? [v("acRequired", `Table 250.66 for ${largestAc!.label}`, acReq, "AWG/kcmil")] : []),
    ...(cap ? [v("electrodeCap", "Largest size the electrodes call for", cap, "AWG/kcmil")] : []),
    v("requiredGec", "Minimum GEC", required, "AWG/kcmil"),
    v("gec", "GEC recorded", gec, "AWG/kcmil"),
  ];
  const parts = [
    dcReq ? `DC: larger of ${sizeLabel(largestDc!)} and ${material === "cu" ? "8 AWG Cu" : "6 AWG Al"} → ${dcReq}` : undefined,
    acReq ? `AC: Table 250.66 for ${largestAc!.label} → ${acReq}` : undefined,
    cap ? `capped at ${cap} for ${g.electrodes.join(" + ")} (250.66(A)–(C), 250.166(C)–(E))` : undefined,
  ].filter(Boolean);
  const formula = `GEC ≥ ${parts.join("; ")}${parts.length ? " → " : ""}${sizeLabel(required, material)}`;
  return makeResult(def, {
    subject: "electrode-system",
    status: ok ? "pass" : "fail",
    message: ok
      ? `Electrodes ${g.electrodes.join(", ")}; ${sizeLabel(gec, material)} GEC meets the ${sizeLabel(required, material)} minimum.`
      : `${sizeLabel(gec, material)} GEC is smaller than the ${sizeLabel(required, material)} the system needs.`,
    ...(ok ? {} : { reason: `GEC ${gec} below ${required}` }),
    remedy: remedy(`Use a ${sizeLabel(required, material)} grounding electrode conductor (${parts.join("; ")}).`, { path: "grounding.gecSize", value: required }),
    values,
    formula,
    inputs: t.inputs,
    codeRefs,
  });
}

/** Equipment that carries an AC neutral and may bond it: inverters, generators, AC panels. */
function bondCandidates(ctx: CheckContext): Indexed<Equipment>[] {
  return ctx.record.equipment
    .map((item, index) => ({ item, index, path: `equipment.${index}` }))
    .filter((e) => e.item.kind === "inverter" || e.item.kind === "inverter-charger" || e.item.kind === "hybrid-inverter" || e.item.kind === "generator" || e.item.kind === "ac-panel");
}

function neutralBond(def: CheckDefinition, ctx: CheckContext): CheckResult | undefined {
  const units = bondCandidates(ctx);
  if (units.length === 0) return undefined;
  const t = new Trace();
  const stationaryGenerator = equipmentOfKind(ctx, "generator").some((gen) => generatorInstallation(gen, new Trace()) === "stationary");
  const codeRefs = refs(ctx.edition, "system-bonding", "objectionable-current", ...(stationaryGenerator ? (["generator-bonding"] as const) : []));
  const bondTag = t.need("grounding.neutralGroundBondTag", "Where the neutral-to-ground bond is made", ctx.record.grounding.neutralGroundBondTag);
  const extra: Indexed<Equipment>[] = [];
  let contradiction: Indexed<Equipment> | undefined;
  for (const u of units) {
    const bonded = (u.item as { neutralBonded?: boolean }).neutralBonded;
    const label = `Neutral bonded to ground in ${u.item.tag}`;
    if (u.item.tag === bondTag) {
      t.read(`${u.path}.neutralBonded`, label, bonded);
      if (bonded === false) contradiction = u;
      continue;
    }
    const b = t.need(`${u.path}.neutralBonded`, label, bonded);
    if (b === true) extra.push(u);
  }
  const values = [v("bondsRecorded", "Neutral-to-ground bonds recorded", extra.length + (bondTag !== undefined && !contradiction ? 1 : 0), "")];
  // With no bond named, a single bonded unit is not yet a second bond: the record still has to name it.
  if (bondTag === undefined && extra.length === 1) extra.length = 0;
  const formula = "exactly one neutral-to-ground bond in the AC system, at the equipment the record names; every other inverter, generator and panel floats its neutral";
  if (extra.length || contradiction) {
    const changes: RemedyChange[] = extra.map((u) => ({ path: `${u.path}.neutralBonded`, value: false }));
    if (contradiction) changes.push({ path: `${contradiction.path}.neutralBonded`, value: true });
    const problems = [
      ...(extra.length ? [`${extra.map((u) => u.item.tag).join(", ")} also bond${extra.length === 1 ? "s" : ""} neutral to ground besides ${bondTag ?? "the named bond"}`] : []),
      ...(contradiction ? [`the bond is named at ${contradiction.item.tag}, but ${contradiction.item.tag} is recorded with its neutral floating`] : []),
    ];
    return makeResult(def, {
      subject: "neutral-bond",
      status: "fail",
      message: `${problems.join("; ")}: neutral current would flow on the grounding conductors (250.6).`,
      reason: problems.join("; "),
      remedy: remedy(
        [
          ...(extra.length ? [`Remove the neutral-to-ground bonding jumper (or disable the bonding relay) in ${extra.map((u) => u.item.tag).join(", ")}, so the only bond is at ${bondTag ?? "one named point"}.`] : []),
          ...(contradiction ? [`Install the bonding jumper in ${contradiction.item.tag}, or name the equipment that holds the bond.`] : []),
        ].join(" "),
        ...changes,
      ),
      values,
      formula,
      inputs: t.inputs,
      codeRefs,
    });
  }
  if (t.missing.length) {
    return needsInput(def, {
      subject: "neutral-bond",
      message: `Needs input: ${t.missing.join(", ")} — name where the one neutral-to-ground bond is made and whether each other unit floats its neutral.`,
      values,
      inputs: t.inputs,
      missing: t.missing,
      codeRefs,
    });
  }
  return makeResult(def, {
    subject: "neutral-bond",
    status: "pass",
    message: `One neutral-to-ground bond, at ${bondTag}; ${units.length - 1 === 0 ? "no other unit carries a neutral" : `${units.filter((u) => u.item.tag !== bondTag).map((u) => u.item.tag).join(", ")} float their neutral`}.`,
    values,
    formula,
    inputs: t.inputs,
    codeRefs,
  });
}

export const groundingElectrode: CheckDefinition = {
  id: "grounding-electrode",
  title: "Grounding electrode system and bonding",
  scopeTopic: "electrode-system",
  formula:
    "electrodes named; GEC ≥ the larger of 250.166 (largest DC conductor, at least 8 AWG Cu) and Table 250.66 (largest AC supply conductor), capped by the electrode kinds; exactly one neutral-to-ground bond",
  run(ctx: CheckContext): CheckResult[] {
    if (ctx.circuits.length === 0) return [];
    const out = [electrodeSystem(this, ctx)];
    const bond = neutralBond(this, ctx);
    if (bond) out.push(bond);
    return out;
  },
};
