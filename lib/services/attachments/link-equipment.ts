import "server-only";
import { refuseWrongEquipmentKind } from "./equipment-kind";
import { and, eq } from "drizzle-orm";
import { attachments, projectEquipment } from "../../../db/schema";
import { tagSchema } from "../../schemas/fields";
import { KIND_RULES, kindsForRoles } from "../../uploads/kinds";
import { audit, requirePermission, type ServiceContext } from "../context";
import { forbidden, invalid } from "../errors";
import { findAttachmentInOrg, revisionsUsing, toView, type AttachmentView } from "./view";

/**
 * Links an attachment to a project equipment tag, or unlinks it (null). The
 * submittal check counts datasheets per tag, so a datasheet always keeps one.
 */
export function linkAttachmentToEquipment(ctx: ServiceContext, id: string, equipmentTag: string | null): AttachmentView {
  requirePermission(ctx, "attachment:upload", "change attachments");
  const row = findAttachmentInOrg(ctx, id);
  const rule = KIND_RULES[row.kind];
  if (!kindsForRoles(ctx.roles).includes(row.kind)) throw forbidden(`change a ${rule.label.toLowerCase()}`);

  let tag: string | null = null;
  let libraryItemId: string | null = null;
  if (equipmentTag !== null && equipmentTag.trim() !== "") {
    const parsed = tagSchema.safeParse(equipmentTag);
    if (!parsed.success) throw invalid("The equipment tag is not valid.", [{ path: "equipmentTag", message: parsed.error.issues[0]?.message ?? "is not valid" }]);
    if (!row.projectId) throw invalid("Only a project's attachment can be linked to one of its equipment tags.");
    const equipment = ctx.db
      .select({ tag: projectEquipment.tag, kind: projectEquipment.kind, libraryItemId: projectEquipment.libraryItemId })
      .from(projectEquipment)
      .where(and(eq(projectEquipment.projectId, row.projectId), eq(projectEquipment.tag, parsed.data)))
      .get();
    if (!equipment) throw invalid(`This project has no equipment tagged “${parsed.data}”.`, [{ path: "equipmentTag", message: "names no equipment of this project" }]);
    refuseWrongEquipmentKind(row.kind, equipment);
    tag = equipment.tag;
    libraryItemId = equipment.libraryItemId;
  } else if (rule.equipment === "required") {
    throw invalid(`A ${rule.label.toLowerCase()} documents one piece of equipment: it keeps a tag.`, [{ path: "equipmentTag", message: `is required for a ${rule.label.toLowerCase()}` }]);
  }

  const updated = ctx.db.transaction((tx) => {
    const next = tx
      .update(attachments)
      .set({ equipmentTag: tag, libraryItemId })
      .where(and(eq(attachments.id, row.id), eq(attachments.orgId, ctx.orgId)))
      .returning()
      .get();
    audit(tx, ctx, "attachment.linked", "attachment", row.id, { projectId: row.projectId, from: row.equipmentTag, to: tag });
    return next;
  });
  return toView(updated, null, revisionsUsing(ctx).get(row.id) ?? []);
}
