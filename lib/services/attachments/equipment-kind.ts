import "server-only";
import { KIND_RULES, type AttachmentKind } from "../../uploads/kinds";
import { ServiceError } from "../errors";

/** A document linked to equipment it cannot document (a storage listing on an inverter) is refused, naming what it can be linked to. */
export function refuseWrongEquipmentKind(kind: AttachmentKind, equipment: { tag: string; kind: string }): void {
  const allowed = KIND_RULES[kind].equipmentKinds;
  if (!allowed || allowed.includes(equipment.kind)) return;
  const label = KIND_RULES[kind].label;
  const wanted = allowed.map((k) => k.replace(/-/g, " ")).join(" or ");
  const actual = equipment.kind.replace(/-/g, " ");
  throw new ServiceError("invalid", `A ${label.toLowerCase()} is linked to ${article(wanted)} ${wanted}; ${equipment.tag} is ${article(actual)} ${actual}.`, [
    { path: "equipmentTag", message: `must name ${article(wanted)} ${wanted}` },
  ]);
}

const article = (noun: string) => (/^[aeiou]/i.test(noun) ? "an" : "a");
