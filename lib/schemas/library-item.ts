import { z } from "zod";
import {
  batterySchema,
  chargeControllerSchema,
  EQUIPMENT_KINDS,
  generatorSchema,
  inverterSchema,
  mpptInputSchema,
  panelSchema,
  protectiveDeviceSchema,
  pvModuleSchema,
  rapidShutdownSchema,
  type Equipment,
  type EquipmentKind,
} from "./project-record";

/**
 * An organisation's equipment library item: the project record's equipment
 * object without what belongs to one project (tag, quantity, the link back to
 * the library). A library item therefore drops into a project unchanged, and
 * every rating is refused or accepted by the same rule as in the project file.
 */

const PROJECT_ONLY = { tag: true, quantity: true, libraryItemId: true } as const;

// A library item is found again by maker and model, so both are required here
// (the project record lets them be empty while a design is half-entered).
const identity = {
  manufacturer: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(120, { message: "must be at most 120 characters" }),
  model: z.string({ error: "is required" }).trim().min(1, { message: "is required" }).max(120, { message: "must be at most 120 characters" }),
};

export const libraryPvModuleSchema = pvModuleSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryChargeControllerSchema = chargeControllerSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryInverterSchema = inverterSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryBatterySchema = batterySchema.omit(PROJECT_ONLY).extend(identity);
export const libraryGeneratorSchema = generatorSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryProtectiveDeviceSchema = protectiveDeviceSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryRapidShutdownSchema = rapidShutdownSchema.omit(PROJECT_ONLY).extend(identity);
export const libraryPanelSchema = panelSchema.omit(PROJECT_ONLY).extend(identity);

export const libraryItemSchema = z.discriminatedUnion("kind", [
  libraryPvModuleSchema,
  libraryChargeControllerSchema,
  libraryInverterSchema,
  libraryBatterySchema,
  libraryGeneratorSchema,
  libraryProtectiveDeviceSchema,
  libraryRapidShutdownSchema,
  libraryPanelSchema,
]);
export type LibraryItemInput = z.input<typeof libraryItemSchema>;
export type LibraryItemData = z.output<typeof libraryItemSchema>;

export const libraryKindSchema = z.enum(EQUIPMENT_KINDS, { error: `must be one of ${EQUIPMENT_KINDS.join(", ")}` });
export { EQUIPMENT_KINDS };
export type { EquipmentKind };

/** The schema of one kind's item, for forms that edit one kind at a time. */
export function librarySchemaForKind(kind: EquipmentKind) {
  switch (kind) {
    case "pv-module":
      return libraryPvModuleSchema;
    case "charge-controller":
      return libraryChargeControllerSchema;
    case "inverter":
    case "inverter-charger":
    case "hybrid-inverter":
      return libraryInverterSchema;
    case "battery":
      return libraryBatterySchema;
    case "generator":
      return libraryGeneratorSchema;
    case "disconnect":
    case "fuse":
    case "breaker":
      return libraryProtectiveDeviceSchema;
    case "rapid-shutdown":
      return libraryRapidShutdownSchema;
    case "ac-panel":
    case "busbar":
      return libraryPanelSchema;
  }
}

/** Ratings as stored and served: everything of the item but kind, manufacturer and model. */
export type LibraryRatings = Record<string, unknown>;

/** A library item as the route handlers serve it (GET /api/library). */
export interface LibraryItemView {
  id: string;
  kind: EquipmentKind;
  manufacturer: string;
  model: string;
  ratings: LibraryRatings;
  retiredAt: string | null;
  version: number;
}

export function splitLibraryItem(item: LibraryItemData): { kind: EquipmentKind; manufacturer: string; model: string; ratings: LibraryRatings } {
  const { kind, manufacturer, model, ...ratings } = item;
  return { kind, manufacturer, model, ratings };
}

/**
 * A project equipment instance from a library item: the editor's picker calls
 * this, then the project record schema validates the result as usual.
 */
export function equipmentFromLibraryItem(item: Pick<LibraryItemView, "id" | "kind" | "manufacturer" | "model" | "ratings">, tag: string, quantity = 1): Equipment {
  return {
    ...item.ratings,
    kind: item.kind,
    manufacturer: item.manufacturer,
    model: item.model,
    tag,
    quantity,
    libraryItemId: item.id,
  } as Equipment;
}

/** Human names of the kinds, for headings and pickers. */
export const KIND_LABELS: Record<EquipmentKind, string> = {
  "pv-module": "PV module",
  "charge-controller": "Charge controller",
  inverter: "Inverter",
  "inverter-charger": "Inverter-charger",
  "hybrid-inverter": "Hybrid inverter",
  battery: "Battery",
  generator: "Generator",
  disconnect: "Disconnect",
  fuse: "Fuse",
  breaker: "Breaker",
  "rapid-shutdown": "Rapid-shutdown device",
  "ac-panel": "AC panel",
  busbar: "Bus bar",
};

export { mpptInputSchema };
