/**
 * A 120 V-only inverter feeding a 120/240 V panel (710.15(C)): the
 * stand-alone supply check and the single-supply warning label both look for
 * it, so one finds exactly what the other marks.
 */
import type { Circuit } from "../../schemas/project-record";
import { equipmentOfKind, isInverter, type CheckContext, type EquipmentOf, type Indexed } from "../context";

type Panel = EquipmentOf<"ac-panel">;
type Inverter = EquipmentOf<"inverter" | "inverter-charger" | "hybrid-inverter">;

export function is120Only(inv: Inverter): boolean {
  // A split-phase output carries both legs of a 120/240 V panel, whatever single voltage was recorded for it.
  if (inv.acOutputPhases === 2) return false;
  if (inv.acOutput !== undefined) return inv.acOutput === "120";
  return inv.acOutputVoltageV !== undefined && inv.acOutputVoltageV <= 130;
}

/** Panels rated 120/240 V fed by a 120 V-only inverter, in a stand-alone system. */
export function singleSupplyPanels(ctx: CheckContext): { panel: Indexed<Panel>; inverter: Indexed<Inverter>; circuit: Indexed<Circuit> }[] {
  if (ctx.record.systemKind === "hybrid") return [];
  const out: { panel: Indexed<Panel>; inverter: Indexed<Inverter>; circuit: Indexed<Circuit> }[] = [];
  for (const p of equipmentOfKind(ctx, "ac-panel")) {
    if (p.item.voltage !== "120/240") continue;
    for (const c of ctx.circuitsByEndpoint.get(p.item.tag) ?? []) {
      if (c.item.kind !== "inverter-ac-output") continue;
      const other = ctx.equipment.get(c.item.fromTag === p.item.tag ? c.item.toTag : c.item.fromTag);
      if (other && isInverter(other.item) && is120Only(other.item)) {
        out.push({ panel: p, inverter: other as Indexed<Inverter>, circuit: c });
      }
    }
  }
  return out;
}
