/** Battery bank figures shared by the circuit, sizing and siting checks. */
import { equipmentOfKind, Trace, type CheckContext, type EquipmentOf, type Indexed } from "../context";

export type Battery = EquipmentOf<"battery">;

/**
 * Charge voltage per nominal volt by chemistry, where the datasheet's charge
 * voltage is not recorded (common practice: LFP 3.65 V per 3.2 V cell, NMC
 * 4.2 V per 3.7 V cell, lead-acid 2.4 V per 2 V cell, nickel-iron 1.65 V per 1.2 V cell).
 */
const CHARGE_RATIO: Record<NonNullable<Battery["chemistry"]>, number> = {
  lfp: 3.65 / 3.2,
  nmc: 4.2 / 3.7,
  "lead-acid-flooded": 2.4 / 2.0,
  "lead-acid-agm": 2.4 / 2.0,
  "nickel-iron": 1.65 / 1.2,
  other: 1.25,
};

export function batteries(ctx: CheckContext): Indexed<Battery>[] {
  return equipmentOfKind(ctx, "battery");
}

/** Highest voltage of the battery circuit: the charge voltage, from the datasheet or the chemistry. */
export function batteryMaxVoltage(b: Indexed<Battery>, t: Trace): number | undefined {
  const given = t.read(`${b.path}.maxChargeVoltageV`, `Charge voltage of ${b.item.tag}`, b.item.maxChargeVoltageV, "V");
  if (given !== undefined) return given;
  const nominal = t.need(`${b.path}.nominalVoltageV`, `Nominal voltage of ${b.item.tag}`, b.item.nominalVoltageV, "V");
  if (nominal === undefined) return undefined;
  const chem = t.read(`${b.path}.chemistry`, `Chemistry of ${b.item.tag}`, b.item.chemistry);
  return nominal * CHARGE_RATIO[chem ?? "other"];
}

/** Energy of one unit, kWh: the rated kWh, else Ah × nominal volts. */
export function unitKWh(b: Indexed<Battery>, t: Trace): number | undefined {
  const kwh = t.read(`${b.path}.capacityKWh`, `Energy of ${b.item.tag}`, b.item.capacityKWh, "kWh");
  if (kwh !== undefined) return kwh;
  const ah = t.need(`${b.path}.capacityAh`, `Capacity of ${b.item.tag}`, b.item.capacityAh, "Ah");
  const vn = t.need(`${b.path}.nominalVoltageV`, `Nominal voltage of ${b.item.tag}`, b.item.nominalVoltageV, "V");
  if (ah === undefined || vn === undefined) {
    if (!t.missing.includes(`${b.path}.capacityKWh`)) t.missing.push(`${b.path}.capacityKWh`);
    return undefined;
  }
  return (ah * vn) / 1000;
}

/** The first battery in the record: the DC bus that controllers and inverters share. */
export function systemBattery(ctx: CheckContext): Indexed<Battery> | undefined {
  return batteries(ctx)[0];
}
