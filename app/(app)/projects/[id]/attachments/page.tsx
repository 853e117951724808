import type { Metadata } from "next";
import { AttachmentList } from "@/components/attachments/attachment-list";
import { AttachmentUploader, type EquipmentOption } from "@/components/attachments/attachment-uploader";
import { SubmittalChecklist, type ChecklistItem } from "@/components/attachments/submittal-checklist";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { documentChecklist } from "@/lib/compliance/documents";
import { env } from "@/lib/env";
import type { ProjectRecord } from "@/lib/schemas/project-record";
import { listProjectAttachments } from "@/lib/services/attachments";
import { kindsForRoles } from "@/lib/uploads/kinds";
import { loadProject } from "../load-project";

export const metadata: Metadata = { title: "Attachments" };

function equipmentDescription(e: ProjectRecord["equipment"][number], withKind = true): string {
  const model = [e.manufacturer, e.model].filter(Boolean).join(" ");
  const kind = e.kind.replace(/-/g, " ");
  if (!model) return kind;
  return withKind ? `${model} (${kind})` : model;
}

/** The jurisdiction's required documents, item by item: the list the submittal check, the preflight and the packet read. */
function checklist(record: ProjectRecord): ChecklistItem[] {
  const byTag = new Map(record.equipment.map((e) => [e.tag, e]));
  return documentChecklist(record, record.attachments, record.jurisdiction.requiredDocuments).map((item) => {
    const e = item.tag ? byTag.get(item.tag) : undefined;
    const detail = e ? equipmentDescription(e) : item.document === "structural-letter" ? "roof mount" : undefined;
    return { label: item.label, attached: item.attached, ...(item.tag ? { tag: item.tag } : {}), ...(detail ? { detail } : {}) };
  });
}

export default async function ProjectAttachmentsPage({ params }: { params: Promise<{ id: string }> }) {
  const { ctx, allowed } = await pageContext("project:read");
  // The project layout shows the refusal.
  if (!allowed) return null;
  const { id } = await params;
  const loaded = loadProject(ctx, id);
  const attachments = listProjectAttachments(ctx, id);
  const kinds = kindsForRoles(ctx.roles);

  let items: ChecklistItem[] = [];
  let note: string | undefined;
  let equipment: EquipmentOption[] = [];
  let jurisdiction = "The jurisdiction";
  if (loaded.ok) {
    const record = loaded.stored.record;
    jurisdiction = record.jurisdiction.name;
    items = checklist(record);
    equipment = record.equipment.map((e) => ({
      tag: e.tag,
      description: equipmentDescription(e, false),
      kind: e.kind,
      documented: record.attachments.filter((a) => a.equipmentTag === e.tag).map((a) => a.kind),
    }));
  } else {
    note = `The design record could not be read, so the required documents cannot be listed: ${loaded.message}`;
  }

  return (
    <div className="space-y-4">
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        {kinds.length > 0 ? (
          <AttachmentUploader projectId={id} kinds={kinds} equipment={equipment} maxBytes={env().UPLOAD_MAX_BYTES} />
        ) : (
          <p className="sheet px-4 py-4 text-sm text-ink-soft">Your role reads the attachments; designers add them.</p>
        )}
        <SubmittalChecklist jurisdiction={jurisdiction} items={items} note={note} />
      </div>
      <section aria-labelledby="attachments-title" className="space-y-2">
        <h2 id="attachments-title" className="text-sm font-semibold">
          Attached files <span className="figure font-normal text-ink-soft">({attachments.length})</span>
        </h2>
        <AttachmentList
          attachments={attachments}
          canDelete={can(ctx.roles, "attachment:delete")}
          linkableKinds={kinds}
          equipmentTags={equipment.map((e) => e.tag)}
        />
        <p className="text-xs text-ink-soft">
          Files are stored by their SHA-256, so the same file added twice is recognised. A file merged into a packet revision is kept with that
          revision and cannot be deleted.
        </p>
      </section>
    </div>
  );
}
