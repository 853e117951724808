/**
 * 18. Submittal completeness: every document the jurisdiction requires is
 * attached before a packet is sent — incomplete submittals are the commonest
 * reason a packet comes back.
 */
import { batteries } from "../derive/battery";
import { Trace, v, type CheckContext } from "../context";
import { refs } from "../refs";
import { makeResult, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

/** Equipment kinds a datasheet is expected for; protective devices, bus bars and panels are listed on the schedule instead. */
export const DATASHEET_KINDS: readonly string[] = ["pv-module", "charge-controller", "inverter", "inverter-charger", "hybrid-inverter", "battery", "generator", "rapid-shutdown"];

export const submittalCompleteness: CheckDefinition = {
  id: "submittal-completeness",
  title: "Submittal completeness",
  run(ctx: CheckContext): CheckResult[] {
    const r = ctx.record;
    const codeRefs = [`${r.jurisdiction.name} submittal requirements`, ...refs(ctx.edition, "listing-use")];
    const t = new Trace();
    t.read("jurisdiction.requiredDocuments", "Documents the jurisdiction requires", r.jurisdiction.requiredDocuments.join(", "));
    const has = (kind: string, tag?: string) => r.attachments.some((a) => a.kind === kind && (tag === undefined || a.equipmentTag === tag));
    const missing: string[] = [];
    const required = new Set(r.jurisdiction.requiredDocuments);
    if (required.has("equipment-datasheets")) {
      for (const e of r.equipment) if (DATASHEET_KINDS.includes(e.kind) && !has("datasheet", e.tag)) missing.push(`no datasheet for ${e.tag}`);
    }
    if (required.has("storage-listing") && batteries(ctx).length > 0 && !has("storage-listing")) missing.push("no storage listing");
    if (required.has("site-plan") && !has("site-plan")) missing.push("no site plan");
    if (required.has("structural-letter") && r.site.mounting === "roof" && !has("structural-letter")) missing.push("no structural letter for the roof mount");
    const ok = missing.length === 0;
    return [
      makeResult(this, {
        status: ok ? "pass" : "fail",
        message: ok ? `Every document ${r.jurisdiction.name} requires is attached (${r.attachments.length} attachments).` : `Incomplete submittal: ${missing.join("; ")}.`,
        ...(ok ? {} : { reason: missing.join("; ") }),
        values: [v("attachments", "Attachments", r.attachments.length, ""), v("missingDocuments", "Missing documents", missing.length, "")],
        formula: `required: ${r.jurisdiction.requiredDocuments.join(", ") || "none"}`,
        inputs: t.inputs,
        missing: ok ? [] : ["attachments"],
        codeRefs,
      }),
    ];
  },
};
