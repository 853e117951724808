/**
 * 9. Battery terminal connections: more conductors than the battery's terminal
 * allows (three by common practice, or the datasheet's figure) need a bus bar
 * (110.14(A): terminals take the number of conductors they are identified for).
 */
import { equipmentOfKind, Trace, v, type CheckContext } from "../context";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

/** Connections per battery terminal without a bus bar (common practice). */
export const DEFAULT_MAX_TERMINAL_CONNECTIONS = 3;

export const batteryTerminals: CheckDefinition = {
  id: "battery-terminals",
  title: "Battery terminal connections",
  scopeTopic: "terminal-rating",
  formula:
    "conductors landed on each battery terminal ≤ the number it allows (three by common practice)",
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "terminal-rating", "listing-use");
    return equipmentOfKind(ctx, "battery").map((b) => {
      const t = new Trace();
      const circuits = ctx.circuitsByEndpoint.get(b.item.tag) ?? [];
      const given = t.read(`${b.path}.maxConnectionsPerTerminal`, "Connections allowed per terminal", b.item.maxConnectionsPerTerminal);
      const limit = given ?? DEFAULT_MAX_TERMINAL_CONNECTIONS;
      const count = circuits.reduce((n, c) => n + c.item.parallelSets, 0);
      for (const c of circuits) t.read(`${c.path}.parallelSets`, `Conductors of ${c.item.tag} per terminal`, c.item.parallelSets);
      const values = [v("connections", "Conductors on each terminal", count, ""), v("limit", given !== undefined ? "Allowed by the datasheet" : "Allowed (common practice)", limit, "")];
      if (circuits.length === 0) {
        return makeResult(this, {
          subject: b.item.tag,
          status: "needs-input",
          message: `${b.item.tag}: no circuit lands on it; record the battery circuits.`,
          reason: "no circuits recorded at the battery",
          values,
          inputs: t.inputs,
          missing: ["circuits"],
          codeRefs,
        });
      }
      const over = count > limit;
      const toBus = circuits.some((c) => ctx.equipment.get(c.item.fromTag === b.item.tag ? c.item.toTag : c.item.fromTag)?.item.kind === "busbar");
      return makeResult(this, {
        subject: b.item.tag,
        status: over ? "fail" : "pass",
        message: over
          ? `${b.item.tag}: ${count} conductors on each terminal, more than the ${limit} allowed; land them on a bus bar${toBus ? " and run one circuit from it to the battery" : ""}.`
          : `${b.item.tag}: ${count} conductor${count === 1 ? "" : "s"} on each terminal, within ${limit}.`,
        ...(over ? { reason: `${count} > ${limit} connections per terminal` } : {}),
        remedy: remedy(
          `Land the ${count} conductors on a bus bar rated for the bank's current and run one conductor set from it to each terminal of ${b.item.tag} (${limit} allowed per terminal).`,
        ),
        values,
        formula: `Σ conductors of ${circuits.map((c) => c.item.tag).join(", ")} = ${count} ≤ ${limit}`,
        inputs: t.inputs,
        codeRefs,
      });
    });
  },
};
