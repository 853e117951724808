/**
 * 15. Rapid shutdown (690.12): PV circuits on or in a building need a named
 * method and the devices that carry it out; on a building-mounted array the
 * record also names how the conductors inside the array boundary are
 * controlled (690.12(B)(2)). A ground-mounted array whose PV circuits enter a
 * building is covered for those circuits, unless the designer states that the
 * building houses PV equipment only (the 690.12 exception).
 */
import { equipmentOfKind, isPvCircuit, Trace, v, type CheckContext } from "../context";
import { rapidShutdownApplies } from "../derive/rapid-shutdown-scope";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

const INSIDE_BOUNDARY_TEXT = {
  "listed-hazard-control": "a listed PV hazard control system",
  "80v-in-30s": "80 V or less within 30 s of initiation",
  "no-exposed-wiring": "no exposed wiring methods or conductive parts",
} as const;

export const rapidShutdown: CheckDefinition = {
  id: "rapid-shutdown",
  title: "Rapid shutdown",
  scopeTopic: "rapid-shutdown",
  formula:
    "PV circuits on or in a building: a named method and the devices that carry it out; on a building-mounted array, the conductors inside the array boundary met by a listed hazard control system, 80 V in 30 s, or no exposed wiring (690.12(B)(2))",
  run(ctx: CheckContext): CheckResult[] {
    const ed = ctx.edition;
    const codeRefs = refs(ed, "rapid-shutdown");
    const t = new Trace();
    t.read("site.mounting", "Mounting", ctx.record.site.mounting);
    if (ctx.record.site.mounting === "ground") {
      for (const c of ctx.circuits) if (isPvCircuit(c.item)) t.read(`${c.path}.entersBuilding`, `${c.item.tag} enters a building`, c.item.entersBuilding);
      t.read("site.pvOnlyBuilding", "Building houses PV equipment only", ctx.record.site.pvOnlyBuilding);
    }
    const scope = rapidShutdownApplies(ctx);
    if (!scope.applies) {
      const exception = ctx.record.site.pvOnlyBuilding === true && ctx.arrays.size > 0;
      return [
        makeResult(this, {
          status: "not-applicable",
          message: `Rapid shutdown does not apply: ${scope.reason}.`,
          reason: scope.reason,
          inputs: t.inputs,
          codeRefs: exception ? [...codeRefs, ...refs(ed, "rapid-shutdown-pv-only-building")] : codeRefs,
        }),
      ];
    }
    const method = t.read("rapidShutdownMethod", "Rapid-shutdown method", ctx.record.rapidShutdownMethod);
    const devices = equipmentOfKind(ctx, "rapid-shutdown");
    for (const d of devices) t.read(`${d.path}.method`, `Method of ${d.item.tag}`, d.item.method);
    const unknownPaths = scope.unknownCircuits.map((c) => `${c.path}.entersBuilding`);
    if (method === undefined && unknownPaths.length) {
      // Either fact clears it: the circuits stay outside, or the method that controls them.
      return [needsInput(this, { message: `${scope.reason}; record whether it enters a building, or the rapid-shutdown method.`, inputs: t.inputs, missing: [...unknownPaths, "rapidShutdownMethod"], codeRefs })];
    }
    if (method === undefined || method === "none") {
      return [
        makeResult(this, {
          status: "fail",
          message: `No rapid-shutdown method named (${scope.reason}); name the method and its devices.`,
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
    const values = [
      v("method", "Method", method, ""),
      v("devices", "Devices", devices.map((d) => `${d.item.quantity} × ${d.item.tag}`).join(", "), ""),
    ];
    const refsOut = [...codeRefs];
    let insideText = "";
    if (scope.insideBoundary) {
      refsOut.push(...refs(ed, "rapid-shutdown-inside-boundary"));
      const inside = t.read("rapidShutdownInsideBoundary", "Inside the array boundary met by", ctx.record.rapidShutdownInsideBoundary);
      if (inside === undefined) {
        return [
          needsInput(this, {
            message: "Name how the PV circuits inside the array boundary are controlled (690.12(B)(2)): a listed hazard control system, 80 V in 30 s, or no exposed wiring.",
            values,
            inputs: t.inputs,
            missing: ["rapidShutdownInsideBoundary"],
            codeRefs: refsOut,
          }),
        ];
      }
      if (inside === "none") {
        return [
          makeResult(this, {
            status: "fail",
            message: `Shutdown by ${method} devices does not by itself meet 690.12(B)(2) inside the array boundary; use a listed PV hazard control system, 80 V or less within 30 s, or no exposed wiring or conductive parts.`,
            reason: "the record meets none of the inside-the-boundary requirements",
            remedy: remedy(
              "Use module-level shutdown devices listed to bring the conductors inside the array boundary to 80 V or less within 30 s, or a listed PV hazard control system, and record which one meets 690.12(B)(2).",
            ),
            values,
            inputs: t.inputs,
            codeRefs: refsOut,
          }),
        ];
      }
      values.push(v("insideBoundary", "Inside the array boundary", INSIDE_BOUNDARY_TEXT[inside], ""));
      insideText = `; inside the array boundary by ${INSIDE_BOUNDARY_TEXT[inside]}`;
    }
    const mismatched = devices.filter((d) => d.item.method !== undefined && d.item.method !== method);
    if (mismatched.length) {
      return [
        makeResult(this, {
          status: "warning",
          message: `${mismatched.map((d) => d.item.tag).join(", ")} serve${mismatched.length === 1 ? "s" : ""} a different method than the "${method}" named; confirm the system is listed together.`,
          reason: "device method differs from the system's method",
          values,
          inputs: t.inputs,
          codeRefs: refsOut,
        }),
      ];
    }
    return [
      makeResult(this, {
        status: "pass",
        message: `Rapid shutdown by ${method} devices: ${devices.map((d) => `${d.item.quantity} × ${d.item.tag}`).join(", ")}${insideText}. Confirm the initiator location on site.`,
        values,
        inputs: t.inputs,
        codeRefs: refsOut,
      }),
    ];
  },
};
