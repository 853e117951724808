/**
 * 13. Energy storage siting for dwellings (IRC R328 in 2021, R330 in 2024,
 * NFPA 855 chapter 15): unit and aggregate energy per location kind, spacing,
 * never in habitable rooms, listing, detection, vehicle-impact protection.
 * The limits come from the siting data per code edition.
 */
import { CHEMISTRY_GROUP, FIRE_CODE_THRESHOLD_KWH, FIRE_CODE_THRESHOLD_REFS, storageSitingRules, type FireCodeChemistryGroup } from "../tables";
import type { NecEdition } from "../../schemas/project-record";
import { Trace, v, type CheckContext, type Indexed } from "../context";
import { batteries, unitKWh, type Battery } from "../derive/battery";
import { makeResult, needsInput, worst, type CheckDefinition } from "../result";
import type { CheckResult, CheckStatus, RemedyChange } from "../types";

/**
 * The fire code a jurisdiction usually adopts beside its NEC edition: NEC 2017 with the 2018 IFC (storage in
 * 1206), NEC 2020 with the 2021 IFC (1207), NEC 2023 with the 2024 IFC (1207); from memory.
 */
function fireCodeRef(edition: NecEdition): string {
  return { "2017": "IFC 2018 1206", "2020": "IFC 2021 1207 / NFPA 855", "2023": "IFC 2024 1207 / NFPA 855" }[edition];
}

export const storageSiting: CheckDefinition = {
  id: "storage-siting",
  title: "Energy storage siting",
  scopeTopic: "ess-listing",
  formula:
    "unit and aggregate kWh within the location's limits, spacing, detection, impact protection, listing",
  run(ctx: CheckContext): CheckResult[] {
    const r = ctx.record;
    const rules = storageSitingRules(r.jurisdiction.residentialCode);
    const codeRefs = [rules.section];
    const bats = batteries(ctx);
    if (bats.length === 0) return [makeResult(this, { status: "not-applicable", message: "No energy storage in the record.", reason: "no battery", codeRefs })];
    const t = new Trace();
    t.read("jurisdiction.residentialCode", "Residential code", r.jurisdiction.residentialCode);
    t.read("site.occupancy", "Occupancy", r.site.occupancy);
    if (r.site.occupancy !== "one-two-family-dwelling") return [outsideDwelling(this, ctx, t, bats)];
    const location = t.need("site.batteryLocation", "Battery location", r.site.batteryLocation);
    let totalKWh = 0;
    let units = 0;
    let allFireTested = true;
    const statuses: CheckStatus[] = ["pass"];
    const problems: string[] = [];
    const notes: string[] = [];
    const fixes: string[] = [];
    const changes: RemedyChange[] = [];
    const values = [];
    for (const b of bats) {
      const kwh = unitKWh(b, t);
      units += b.item.quantity;
      t.read(`${b.path}.largeScaleFireTested`, `Large-scale fire tested (${b.item.tag})`, b.item.largeScaleFireTested);
      if (!b.item.largeScaleFireTested) allFireTested = false;
      if (kwh !== undefined) {
        totalKWh += kwh * b.item.quantity;
        values.push(v(`unitKWh:${b.item.tag}`, `Energy per unit of ${b.item.tag}`, kwh, "kWh"));
        if (kwh > rules.maxUnitKWh) {
          statuses.push("fail");
          problems.push(`${b.item.tag} holds ${kwh} kWh per unit, above the ${rules.maxUnitKWh} kWh limit (${rules.sections.energyRatings})`);
          fixes.push(`Use storage units of at most ${rules.maxUnitKWh} kWh each.`);
        }
      }
      const listing = t.read(`${b.path}.listing`, `Listing of ${b.item.tag}`, b.item.listing || undefined);
      if (listing === undefined) {
        t.need(`${b.path}.listing`, `Listing of ${b.item.tag}`, undefined);
      } else if (!/9540(?!A)/i.test(listing)) {
        statuses.push("fail");
        problems.push(`${b.item.tag} is not recorded as listed to UL 9540`);
        fixes.push(`Use storage listed to UL 9540 for ${b.item.tag}.`);
      }
    }
    if (location === undefined || t.missing.length) {
      return [needsInput(this, { inputs: t.inputs, missing: t.missing, values, codeRefs })];
    }
    if (totalKWh < rules.exemptBelowKWh && !problems.length) {
      return [
        makeResult(this, {
          status: "pass",
          message: `${totalKWh.toFixed(2)} kWh in all, below the ${rules.exemptBelowKWh} kWh under which ${rules.section} does not apply.`,
          values: [...values, v("aggregateKWh", "Aggregate energy", totalKWh, "kWh"), v("exemptBelowKWh", "Threshold of the dwelling rules", rules.exemptBelowKWh, "kWh")],
          formula: `Σ unit kWh × quantity = ${totalKWh.toFixed(2)} kWh < ${rules.exemptBelowKWh} kWh`,
          inputs: t.inputs,
          codeRefs,
        }),
      ];
    }
    if (location === "habitable-room") {
      statuses.push("fail");
      problems.push(`storage may not stand in a habitable room, sleeping room or a closet opening into one (${rules.sections.locations})`);
      fixes.push(`Move the storage to ${Object.keys(rules.aggregateKWhByLocation).filter((k) => k !== "habitable-room" && rules.aggregateKWhByLocation[k as keyof typeof rules.aggregateKWhByLocation] !== undefined).join(", ")}.`);
    }
    const local = r.jurisdiction.storageAggregateLimitKWh;
    const tableLimit = rules.aggregateKWhByLocation[location];
    const limit = local ?? tableLimit ?? undefined;
    if (local !== undefined) t.read("jurisdiction.storageAggregateLimitKWh", "Local aggregate limit", local, "kWh");
    values.push(v("aggregateKWh", "Aggregate energy", totalKWh, "kWh"));
    if (limit !== undefined) {
      values.push(v("aggregateLimitKWh", local !== undefined ? `${r.jurisdiction.name} limit` : `Limit for ${location}`, limit, "kWh"));
      if (totalKWh > limit) {
        statuses.push("fail");
        problems.push(`${totalKWh.toFixed(2)} kWh in the ${location} exceeds the ${limit} kWh allowed (${local !== undefined ? "local amendment" : rules.sections.energyRatings})`);
        const only = bats.length === 1 ? bats[0]! : undefined;
        const perUnit = only ? totalKWh / only.item.quantity : undefined;
        const fit = perUnit ? Math.floor(limit / perUnit + 1e-9) : 0;
        if (only && fit >= 1) {
          fixes.push(`Keep at most ${fit} × ${only.item.tag} (${(fit * perUnit!).toFixed(1)} kWh) in the ${location}, and site the rest elsewhere.`);
          changes.push({ path: `${only.path}.quantity`, value: fit });
        } else fixes.push(`Keep at most ${limit} kWh in the ${location}, and site the rest elsewhere.`);
      }
    }
    if (units > 1 && !allFireTested) {
      const spacing = t.need("site.batterySpacingIn", "Spacing between units", r.site.batterySpacingIn, "in");
      if (spacing === undefined) statuses.push("needs-input");
      else {
        values.push(v("spacingIn", "Spacing between units", spacing, "in"), v("minSpacingIn", "Minimum spacing", rules.minSpacingIn, "in"));
        if (spacing < rules.minSpacingIn) {
          statuses.push("fail");
          problems.push(`units stand ${spacing} in apart, less than ${rules.minSpacingIn} in, and not every unit is backed by large-scale fire testing (${rules.sections.spacing})`);
          fixes.push(`Space the units at least ${rules.minSpacingIn} in apart (or use units backed by large-scale fire testing).`);
          changes.push({ path: "site.batterySpacingIn", value: rules.minSpacingIn });
        }
      }
    }
    if (rules.requiresDetectionIn.includes(location)) {
      const det = t.need("site.hasSmokeOrHeatDetection", "Smoke or heat detection", r.site.hasSmokeOrHeatDetection);
      if (det === undefined) statuses.push("needs-input");
      else if (!det) {
        statuses.push("fail");
        problems.push(`no smoke alarm or heat detector where the storage stands (${rules.sections.detection})`);
        fixes.push(`Install a heat detector (or smoke alarm) interconnected with the dwelling's alarms where the storage stands, and record it.`);
      }
    }
    if (rules.requiresImpactProtectionIn.includes(location)) {
      const imp = t.need("site.hasVehicleImpactProtection", "Vehicle-impact protection", r.site.hasVehicleImpactProtection);
      if (imp === undefined) statuses.push("needs-input");
      else if (!imp) {
        statuses.push("fail");
        problems.push(`no vehicle-impact protection in the ${location} (${rules.sections.impactProtection})`);
        fixes.push(`Protect the units from vehicle impact (bollards or a barrier), and record it.`);
      }
    }
    if (location === "accessory-building") notes.push("where vehicles can reach the units, protect them from impact");
    if (location === "exterior-wall" || location === "outdoors") notes.push(`keep units at least ${rules.minFromDoorsAndWindowsIn} in from doors and windows into the dwelling`);
    if (statuses.includes("needs-input") && !problems.length) {
      return [needsInput(this, { inputs: t.inputs, missing: t.missing, values, codeRefs })];
    }
    if (notes.length) statuses.push("attest");
    const status = worst(...statuses);
    const refsOut = [...codeRefs, rules.sections.locations, rules.sections.energyRatings];
    return [
      makeResult(this, {
        status,
        message:
          status === "fail"
            ? `${problems.join("; ")}.`
            : `${totalKWh.toFixed(2)} kWh in the ${location}${limit !== undefined ? ` (limit ${limit} kWh)` : ""}, units within ${rules.maxUnitKWh} kWh${notes.length ? `; confirm on site: ${notes.join("; ")}` : ""}.`,
        ...(status === "pass" ? {} : { reason: [...problems, ...notes].join("; ") }),
        remedy: () => (fixes.length ? { text: fixes.join(" "), changes } : undefined),
        values,
        formula: `Σ unit kWh × quantity = ${totalKWh.toFixed(2)} kWh ≤ ${limit ?? "—"} kWh; each unit ≤ ${rules.maxUnitKWh} kWh`,
        inputs: t.inputs,
        missing: t.missing,
        codeRefs: refsOut,
      }),
    ];
  },
};

/**
 * Outside one- and two-family dwellings the dwelling limits do not apply; the fire code's storage provisions do,
 * above its threshold quantities. Below them the result says so with the figures and passes; above them a person
 * confirms the siting under the fire code, which Sundocket does not check.
 */
function outsideDwelling(def: CheckDefinition, ctx: CheckContext, t: Trace, bats: Indexed<Battery>[]): CheckResult {
  const thresholdRefs = FIRE_CODE_THRESHOLD_REFS[ctx.edition];
  // Where the batteries stand is asked of every design with storage: the packet's site plan and the fire code's room limits start from it.
  t.need("site.batteryLocation", "Battery location", ctx.record.site.batteryLocation);
  const byGroup = new Map<FireCodeChemistryGroup, number>();
  for (const b of bats) {
    const kwh = unitKWh(b, t);
    const chem = t.need(`${b.path}.chemistry`, `Chemistry of ${b.item.tag}`, b.item.chemistry);
    if (kwh === undefined || chem === undefined) continue;
    const group = CHEMISTRY_GROUP[chem];
    byGroup.set(group, (byGroup.get(group) ?? 0) + kwh * b.item.quantity);
  }
  if (t.missing.length) return needsInput(def, { inputs: t.inputs, missing: t.missing, codeRefs: [...thresholdRefs] });
  const values = [];
  const terms: string[] = [];
  let ratio = 0;
  for (const [group, kwh] of byGroup) {
    const limit = FIRE_CODE_THRESHOLD_KWH[group];
    ratio += kwh / limit;
    terms.push(`${kwh.toFixed(2)} kWh ${group} ÷ ${limit} kWh`);
    values.push(v(`kWh:${group}`, `Energy, ${group}`, kwh, "kWh"), v(`thresholdKWh:${group}`, `Threshold, ${group}`, limit, "kWh"));
  }
  values.push(v("thresholdRatio", "Share of the threshold quantity", ratio, ""));
  const formula = `Σ (energy of each chemistry ÷ its threshold) = ${terms.join(" + ")} = ${ratio.toFixed(3)} ≤ 1 → below the threshold quantity`;
  if (ratio <= 1) {
    const [group, kwh] = [...byGroup][0]!;
    const what =
      byGroup.size === 1
        ? `${kwh.toFixed(2)} kWh of ${group} storage is at most the ${FIRE_CODE_THRESHOLD_KWH[group]} kWh threshold`
        : `the storage is ${(ratio * 100).toFixed(0)} % of the mixed threshold quantity`;
    return makeResult(def, {
      status: "pass",
      message: `Not a one- or two-family dwelling, and ${what} (${thresholdRefs[0]}): the fire code's storage provisions do not apply.`,
      values,
      formula,
      inputs: t.inputs,
      codeRefs: [...thresholdRefs],
    });
  }
  return makeResult(def, {
    status: "attest",
    message: `Not a one- or two-family dwelling, and the storage is above the fire code's threshold quantity (${(ratio * 100).toFixed(0)} %, ${thresholdRefs[0]}): confirm siting, separation and detection under the fire code with the AHJ.`,
    reason: "above the threshold quantity the fire code's storage provisions apply, which Sundocket does not check",
    values,
    formula,
    inputs: t.inputs,
    codeRefs: [...thresholdRefs, fireCodeRef(ctx.edition)],
  });
}
