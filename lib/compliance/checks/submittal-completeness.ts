/**
 * 18. Submittal completeness: every document the jurisdiction requires is
 * attached before a packet is sent — incomplete submittals are the commonest
 * reason a packet comes back.
 */
import { missingDocuments } from "../documents";
import { Trace, v, type CheckContext } from "../context";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";


export const submittalCompleteness: CheckDefinition = {
  id: "submittal-completeness",
  title: "Submittal completeness",
  scopeTopic: "listing-use",
  formula:
    "every document the jurisdiction requires is attached",
  run(ctx: CheckContext): CheckResult[] {
    const r = ctx.record;
    const codeRefs = [`${r.jurisdiction.name} submittal requirements`, ...refs(ctx.edition, "listing-use")];
    const t = new Trace();
    t.read("jurisdiction.requiredDocuments", "Documents the jurisdiction requires", r.jurisdiction.requiredDocuments.join(", "));
    const missing = missingDocuments(r, r.attachments, r.jurisdiction.requiredDocuments);
    const ok = missing.length === 0;
    return [
      makeResult(this, {
        status: ok ? "pass" : "fail",
        message: ok ? `Every document ${r.jurisdiction.name} requires is attached (${r.attachments.length} attachments).` : `Incomplete submittal: ${missing.join("; ")}.`,
        ...(ok ? {} : { reason: missing.join("; ") }),
        remedy: remedy(`Attach ${missing.join("; ")} on the project's attachments page.`),
        values: [v("attachments", "Attachments", r.attachments.length, ""), v("missingDocuments", "Missing documents", missing.length, "")],
        formula: `required: ${r.jurisdiction.requiredDocuments.join(", ") || "none"}`,
        inputs: t.inputs,
        missing: ok ? [] : ["attachments"],
        codeRefs,
      }),
    ];
  },
};
