/** 12. Labels required: the set the system needs, each with its computed values and where it goes (110.21(B) for durability). */
import { v, type CheckContext } from "../context";
import { labelsFor } from "../labels";
import { refs } from "../refs";
import { makeResult, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

export const labelsRequired: CheckDefinition = {
  id: "labels",
  title: "Labels required",
  scopeTopic: "field-marking",
  formula:
    "one label per requirement, with the computed values, where the code puts it",
  run(ctx: CheckContext): CheckResult[] {
    const labels = labelsFor(ctx);
    const codeRefs = [...refs(ctx.edition, "field-marking"), ...labels.map((l) => l.codeRef)];
    if (labels.length === 0) {
      return [makeResult(this, { status: "not-applicable", message: "No labels are required for this record.", reason: "no PV, storage or distribution equipment", codeRefs })];
    }
    const values = labels.map((l) => v(l.id, `${l.signalWord}: ${l.title}`, `${l.lines.join(" / ")} — ${l.location}`, ""));
    const missing = [...new Set(labels.flatMap((l) => l.missing ?? []))];
    if (missing.length) {
      const blank = labels.filter((l) => l.missing?.length).map((l) => l.id);
      return [
        makeResult(this, {
          status: "needs-input",
          message: `${labels.length} labels required; ${blank.join(", ")} cannot be printed until the missing values are entered.`,
          reason: `label values missing: ${missing.join(", ")}`,
          values,
          formula: "one label per requirement, values from the voltage, current and storage checks",
          missing,
          codeRefs,
        }),
      ];
    }
    return [
      makeResult(this, {
        status: "attest",
        message: `${labels.length} labels required; confirm each is installed where listed, durable and legible (110.21(B)) — the packet is incomplete while any is missing.`,
        reason: "placement is confirmed on site",
        values,
        formula: "one label per requirement, values from the voltage, current and storage checks",
        codeRefs,
      }),
    ];
  },
};
