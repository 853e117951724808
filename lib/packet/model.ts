import { missingDocuments as missingOnFileDocuments } from "../compliance/documents";
import { templateContext } from "./context";
import { packetDraftReasons } from "./draft";
import { isoDate } from "./format";
import type { Block } from "./markup";
import { AHJ_FOOTER, REVIEW_MARKING, SHEET_PLAN, type PacketDatasheet, type PacketModel, type Sheet } from "./plan";
import { conductorBlocks } from "./sheets/conductors";
import { equipmentBlocks } from "./sheets/equipment";
import { panelScheduleBlocks } from "./sheets/panel-schedule";
import { racewayFillBlocks } from "./sheets/raceway-fill";
import { groundingBlocks } from "./sheets/grounding";
import { reviewBlocks } from "./sheets/review-record";
import { sitePlanBlocks } from "./sheets/site-plan";
import { storageBlocks } from "./sheets/storage";
import { readableResult } from "./record-words";
import { renderSheetTemplate } from "./templates";
import type { PacketInput } from "./types";

export * from "./plan";
export { templateContext };

/**
 * The documents the jurisdiction requires that the packet does not carry, in
 * the submittal check's words: the record's attachment list plus what this
 * packet was handed to merge.
 */
export function missingDocuments(input: PacketInput): string[] {
  const { record } = input;
  const onFile = [
    ...record.attachments,
    ...input.datasheets.map((d) => ({ kind: /listing/i.test(d.title) ? "storage-listing" : "datasheet", equipmentTag: d.equipmentTag })),
    ...(input.sitePlan ? [{ kind: "site-plan" }] : []),
  ];
  return missingOnFileDocuments(record, onFile, record.jurisdiction.requiredDocuments);
}

export interface BuildOptions {
  /** Packet page ranges per sheet code, for the sheet index (known after a first layout pass). */
  sheetPages?: Map<string, string>;
  /** Sheet numbers per plan code when its content ran onto added sheets ("E-003 to E-003.2"). */
  sheetNumbers?: Map<string, string>;
}

export function buildPacketModel(input: PacketInput, options: BuildOptions = {}): PacketModel {
  const { record, revision, approval } = input;
  const sheetPages = options.sheetPages ?? new Map<string, string>();
  const datasheets: PacketDatasheet[] = input.datasheets.map((d, i) => ({
    code: `D-${String(i + 1).padStart(3, "0")}`,
    title: d.equipmentTag ? `${d.title} (${d.equipmentTag})` : d.title,
    equipmentTag: d.equipmentTag,
    bytes: d.bytes,
  }));
  const missingDocs = missingDocuments(input);
  const reasons = packetDraftReasons(input.record, input.run, input.labels, missingDocs);
  const draft = { isDraft: reasons.length > 0, reasons };

  const sheets: Sheet[] = SHEET_PLAN.map((plan) => {
    const context = templateContext(input, { code: plan.code, title: plan.title, kind: plan.kind }, sheetPages, datasheets, draft, options.sheetNumbers);
    const blocks = renderSheetTemplate(plan.template, context, input.templateOverrides?.[plan.template]);
    switch (plan.kind) {
      case "site-plan":
        blocks.push(...sitePlanBlocks(input));
        break;
      case "one-line":
        blocks.unshift({ kind: "figure", figure: "one-line", caption: "One-line diagram" });
        break;
      case "energy-storage":
        blocks.push(...storageBlocks(input));
        break;
      case "calculations":
        blocks.push(...input.run.results.map((result): Block => ({ kind: "check", result })));
        break;
      case "conductor-schedule":
        blocks.push(...conductorBlocks(input), ...racewayFillBlocks(input));
        break;
      case "equipment-schedule":
        blocks.push(...equipmentBlocks(input, datasheets), ...panelScheduleBlocks(input));
        break;
      case "label-schedule":
        blocks.push({ kind: "labels", labels: input.labels });
        break;
      case "grounding":
        blocks.push(...groundingBlocks(input));
        break;
      case "review-record":
        blocks.push(...reviewBlocks(input));
        break;
      default:
        break;
    }
    // Check cards name missing values with the designer's field labels, on every sheet and in both writers.
    const readable = blocks.map((b): Block => (b.kind === "check" ? { ...b, result: readableResult(record, b.result) } : b));
    return { code: plan.code, title: plan.title, kind: plan.kind, columns: plan.columns, blocks: readable };
  });

  const approvalLines = approval
    ? [
        `Approved ${isoDate(approval.approvedAt)} by ${approval.reviewerName}, licence ${approval.licenceNumber} (${approval.licenceState}, ${approval.licenceDiscipline})`,
        `Record SHA-256 ${approval.recordSha256}`,
      ]
    : [];

  return {
    titleBlock: {
      firm: revision.organisation,
      firmLicence: revision.organisationLicence?.number
        ? `Licence ${[revision.organisationLicence.number, revision.organisationLicence.classification, revision.organisationLicence.state].filter(Boolean).join(" · ")}`
        : "",
      firmContact: [revision.organisationContact?.phone, revision.organisationContact?.email, revision.organisationContact?.address].filter(Boolean).join(" · "),
      preparedBy: revision.preparedBy,
      project: record.name,
      client: record.client,
      address: record.site.address,
      jurisdiction: record.jurisdiction.name,
      edition: `NEC ${input.run.edition}`,
      revision: String(revision.number),
      date: isoDate(revision.createdAt),
    },
    sheets,
    datasheets,
    marking: { approved: Boolean(approval), reviewText: REVIEW_MARKING, approvalLines, footer: AHJ_FOOTER },
    draft,
    missingDocuments: missingDocs,
  };
}
