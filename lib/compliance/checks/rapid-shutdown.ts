/**
 * 15. Rapid shutdown (690.12): PV circuits on or in a building need a named
 * method and the devices that carry it out. Ground-mounted arrays are outside
 * 690.12, with the reason given.
 */
import { equipmentOfKind, Trace, v, type CheckContext } from "../context";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

export function rapidShutdownApplies(ctx: CheckContext): { applies: boolean; reason: string } {
  if (ctx.arrays.size === 0) return { applies: false, reason: "no PV array in the record" };
  if (ctx.record.site.mounting === "ground") {
    return {
      applies: false,
      reason:
        "ground-mounted array: 690.12 covers PV circuits on or in buildings; where the PV circuits enter a building other than one housing only PV equipment, confirm with the AHJ how the part inside is controlled",
    };
  }
  return { applies: true, reason: "roof-mounted array: PV circuits on a building" };
}

export const rapidShutdown: CheckDefinition = {
  id: "rapid-shutdown",
  title: "Rapid shutdown",
  scopeTopic: "rapid-shutdown",
  formula:
    "PV circuits on or in a building: a named method and the devices that carry it out",
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "rapid-shutdown");
    const t = new Trace();
    t.read("site.mounting", "Mounting", ctx.record.site.mounting);
    const scope = rapidShutdownApplies(ctx);
    if (!scope.applies) {
      return [makeResult(this, { status: "not-applicable", message: `Rapid shutdown does not apply: ${scope.reason}.`, reason: scope.reason, inputs: t.inputs, codeRefs })];
    }
    const method = t.read("rapidShutdownMethod", "Rapid-shutdown method", ctx.record.rapidShutdownMethod);
    const devices = equipmentOfKind(ctx, "rapid-shutdown");
    for (const d of devices) t.read(`${d.path}.method`, `Method of ${d.item.tag}`, d.item.method);
    if (method === undefined || method === "none") {
      return [
        makeResult(this, {
          status: "fail",
          message: "No rapid-shutdown method named for a roof-mounted array; name the method and its devices.",
          reason: method === "none" ? "the record states no rapid-shutdown method" : "rapidShutdownMethod is empty",
          inputs: t.inputs,
          missing: method === undefined ? ["rapidShutdownMethod"] : [],
          remedy: remedy(
            "Name the rapid-shutdown method (module-level shutdown devices, or a listed PV hazard control system) and record its devices with their quantity and the initiator.",
          ),
          codeRefs,
        }),
      ];
    }
    if (devices.length === 0) {
      return [
        makeResult(this, {
          status: "fail",
          message: `Method "${method}" is named but no rapid-shutdown device is recorded.`,
          reason: "no equipment of kind rapid-shutdown",
          remedy: remedy(`Record the ${method} rapid-shutdown devices (kind rapid-shutdown, with their quantity: one per module or pair of modules for module-level shutdown) and the initiator.`),
          inputs: t.inputs,
          codeRefs,
        }),
      ];
    }
    const mismatched = devices.filter((d) => d.item.method !== undefined && d.item.method !== method);
    const values = [
      v("method", "Method", method, ""),
      v("devices", "Devices", devices.map((d) => `${d.item.quantity} × ${d.item.tag}`).join(", "), ""),
    ];
    if (mismatched.length) {
      return [
        makeResult(this, {
          status: "warning",
          message: `${mismatched.map((d) => d.item.tag).join(", ")} serve${mismatched.length === 1 ? "s" : ""} a different method than the "${method}" named; confirm the system is listed together.`,
          reason: "device method differs from the system's method",
          values,
          inputs: t.inputs,
          codeRefs,
        }),
      ];
    }
    return [
      makeResult(this, {
        status: "pass",
        message: `Rapid shutdown by ${method} devices: ${devices.map((d) => `${d.item.quantity} × ${d.item.tag}`).join(", ")}. Confirm the initiator location on site.`,
        values,
        inputs: t.inputs,
        codeRefs,
      }),
    ];
  },
};
