import { describe, expect, it } from "vitest";
import { changeKind, RATING_FIELDS } from "../../../components/workspace/equipment-fields";
import { EQUIPMENT_KINDS, equipmentSchema } from "../../../lib/schemas/project-record";

/** Fields every kind shares, edited in the equipment grid itself; mpptInputs has its own grid. */
const GRID_KEYS = new Set(["tag", "kind", "manufacturer", "model", "quantity", "listing", "libraryItemId", "mpptInputs"]);

describe("equipment ratings the editor offers", () => {
  it.each(EQUIPMENT_KINDS)("cover every field of the record schema for %s", (kind) => {
    const option = equipmentSchema.options.find((o) => {
      const k = o.shape.kind;
      return "options" in k ? (k.options as readonly string[]).includes(kind) : k.value === kind;
    });
    expect(option).toBeDefined();
    const schemaKeys = Object.keys(option!.shape).filter((k) => !GRID_KEYS.has(k));
    const offered = RATING_FIELDS[kind].map((f) => f.key);
    expect(offered.sort()).toEqual(schemaKeys.sort());
  });

  it("keep the shared fields and drop the old kind's ratings when the kind changes", () => {
    const module = { tag: "MOD-1", kind: "pv-module", manufacturer: "Brightfell", model: "BF-48", quantity: 2, listing: "UL 61730", vocV: 48 };
    const controller = changeKind(module, "charge-controller");
    expect(controller).toMatchObject({ tag: "MOD-1", kind: "charge-controller", manufacturer: "Brightfell", quantity: 2, batteryVoltagesV: [] });
    expect(controller).not.toHaveProperty("vocV");
    expect(equipmentSchema.safeParse(controller).success).toBe(true);
  });
});
