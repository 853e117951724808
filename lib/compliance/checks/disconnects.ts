/**
 * 6. Disconnecting means (690.13, 690.15, 706.15, 445.18): each PV array,
 * battery, generator and inverter can be isolated. A disconnect built into
 * the equipment counts when the equipment record says so.
 */
import type { Circuit } from "../../schemas/project-record";
import { equipmentOfKind, isDcCircuit, isInverter, Trace, type CheckContext, type Indexed } from "../context";
import { remedy } from "../derive/remedy";
import { circuitsNear, switchingDevicesOn } from "../derive/switching";
import { refs, storageRefs } from "../refs";
import { makeResult, type CheckDefinition } from "../result";
import type { CheckResult, Remedy } from "../types";

export const disconnects: CheckDefinition = {
  id: "disconnects",
  title: "Disconnecting means",
  scopeTopic: "pv-disconnect",
  formula:
    "a disconnect or breaker on a circuit of the item, or one built into the equipment",
  run(ctx: CheckContext): CheckResult[] {
    const ed = ctx.edition;
    const out: CheckResult[] = [];
    const report = (subject: string, found: string[], builtIn: string | undefined, what: string, codeRefs: string[], t: Trace, noCircuits: boolean, circuits: Indexed<Circuit>[] = []) => {
      if (found.length || builtIn) {
        out.push(
          makeResult(this, {
            subject,
            status: "pass",
            message: `${subject}: ${what} by ${[...found, ...(builtIn ? [builtIn] : [])].join(", ")}.`,
            inputs: t.inputs,
            codeRefs,
          }),
        );
      } else if (noCircuits) {
        out.push(
          makeResult(this, {
            subject,
            status: "needs-input",
            message: `${subject}: no circuit connects it, so its disconnecting means cannot be checked.`,
            reason: "no circuits recorded",
            inputs: t.inputs,
            missing: ["circuits"],
            codeRefs,
          }),
        );
      } else {
        out.push(
          makeResult(this, {
            subject,
            status: "fail",
            message: `${subject}: no disconnecting means — ${what.replace(/^isolated/, "it must be isolated")}.`,
            reason: `no disconnect or breaker on the circuits of ${subject}, and none built in`,
            remedy: addDisconnectRemedy(subject, circuits),
            inputs: t.inputs,
            codeRefs,
          }),
        );
      }
    };

    for (const { item: array, path } of ctx.arrays.values()) {
      const t = new Trace();
      const circuits = ctx.circuitsByArray.get(array.tag) ?? [];
      const found = circuits.flatMap((c) => switchingDevicesOn(ctx, c.item));
      const fed = ctx.equipment.get(array.feedsTag);
      const builtIn = fed && "hasPvDisconnect" in fed.item && fed.item.hasPvDisconnect ? `the PV disconnect built into ${fed.item.tag}` : undefined;
      if (fed && "hasPvDisconnect" in fed.item) t.read(`${fed.path}.hasPvDisconnect`, `PV disconnect built into ${fed.item.tag}`, fed.item.hasPvDisconnect);
      t.read(`${path}.feedsTag`, "Equipment fed", array.feedsTag);
      report(array.tag, [...new Set(found)], builtIn, "isolated from the equipment it feeds", refs(ed, "pv-disconnect", "pv-equipment-disconnect"), t, circuits.length === 0 && !builtIn, circuits);
    }

    for (const b of equipmentOfKind(ctx, "battery")) {
      const t = new Trace();
      const near = circuitsNear(ctx, b.item.tag);
      const found = near.flatMap((c) => switchingDevicesOn(ctx, c.item));
      report(b.item.tag, [...new Set(found)], undefined, "isolated from every circuit it feeds", storageRefs(ctx, "ess-disconnect"), t, near.length === 0, near);
    }

    for (const g of equipmentOfKind(ctx, "generator")) {
      const t = new Trace();
      const near = ctx.circuitsByEndpoint.get(g.item.tag) ?? [];
      t.read(`${g.path}.hasOutputDisconnect`, "Output disconnect built in", g.item.hasOutputDisconnect);
      const found = near.flatMap((c) => switchingDevicesOn(ctx, c.item));
      report(g.item.tag, [...new Set(found)], g.item.hasOutputDisconnect ? `the output disconnect built into ${g.item.tag}` : undefined, "isolated from the system", refs(ed, "generator-disconnect"), t, near.length === 0 && !g.item.hasOutputDisconnect, near);
    }

    for (const inv of ctx.record.equipment.map((item, index) => ({ item, index, path: `equipment.${index}` })).filter((e) => isInverter(e.item))) {
      const t = new Trace();
      const near = ctx.circuitsByEndpoint.get(inv.item.tag) ?? [];
      const dc = near.filter((c) => c.item.kind === "battery" || c.item.kind === "inverter-dc-input");
      const ac = near.filter((c) => c.item.kind === "inverter-ac-output");
      const missingSides: string[] = [];
      const found: string[] = [];
      for (const [side, list] of [["DC input", dc], ["AC output", ac]] as const) {
        if (list.length === 0) continue;
        const devs = list.flatMap((c) => switchingDevicesOn(ctx, c.item));
        if (devs.length === 0) missingSides.push(side);
        found.push(...devs);
      }
      const codeRefs = refs(ed, "pv-equipment-disconnect");
      if (near.length === 0) {
        report(inv.item.tag, [], undefined, "", codeRefs, t, true);
      } else if (missingSides.length) {
        out.push(
          makeResult(this, {
            subject: inv.item.tag,
            status: "fail",
            message: `${inv.item.tag}: no disconnecting means on its ${missingSides.join(" and ")} side.`,
            reason: `the ${missingSides.join(" and ")} circuits of ${inv.item.tag} carry no disconnect or breaker`,
            remedy: addDisconnectRemedy(
              inv.item.tag,
              [...(missingSides.includes("DC input") ? dc : []), ...(missingSides.includes("AC output") ? ac : [])],
            ),
            inputs: t.inputs,
            codeRefs,
          }),
        );
      } else {
        report(inv.item.tag, [...new Set(found)], undefined, "isolated on each side", codeRefs, t, false);
      }
    }
    return out;
  },
};

/** The missing device: where it goes and what it must be rated for. */
function addDisconnectRemedy(subject: string, circuits: Indexed<Circuit>[]): Remedy {
  const on = circuits.length ? ` on ${circuits.map((c) => c.item.tag).join(" or ")}` : "";
  const dc = circuits.some((c) => isDcCircuit(c.item));
  return remedy(
    `Add a ${dc ? "DC-rated " : ""}disconnect or breaker${on}, rated for the circuit's voltage and current, and record it among the circuit's disconnects (or use equipment with one built in) so ${subject} can be isolated.`,
  );
}
