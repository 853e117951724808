import "server-only";
import { runChecks, type CheckRun, type CheckStatus } from "../../compliance";
import { requiredLabels } from "../../compliance/labels";
import { packetDraftReasons } from "../../packet/draft";
import { DEFAULT_REQUIRED_DOCUMENTS, labelGap, REQUIRED_DOCUMENT_LABELS, type RequiredDocument } from "../../schemas/vocabulary";
import { listProjectAttachments } from "../attachments";
import { requirePermission, type ServiceContext } from "../context";
import { getProjectRecord, type StoredProjectRecord } from "../projects/get-record";
import { missingDocuments, selectPacketDocuments, type DocumentRef, type PacketDocuments } from "./documents";

export interface PreflightCheck {
  id: string;
  checkId: string;
  title: string;
  subject: string | null;
  status: CheckStatus;
  message: string;
}

export interface Preflight {
  projectId: string;
  projectName: string;
  jurisdictionName: string;
  /** True when the project has no jurisdiction record and the default document set applies. */
  defaultDocuments: boolean;
  requiredDocuments: { id: RequiredDocument; label: string }[];
  missingDocuments: string[];
  /** Checks that fail or need input, worst first. */
  failingChecks: PreflightCheck[];
  counts: CheckRun["counts"];
  edition: CheckRun["edition"];
  /** Required labels that cannot be printed as they stand, each named with what it lacks. */
  missingLabels: string[];
  /** What the packet will merge, in order. */
  documents: { id: string; kind: string; fileName: string; equipmentTag: string | null }[];
  /** A packet generated now is a draft, and says so on its cover. */
  isDraft: boolean;
  draftReasons: string[];
}

export interface PreflightParts {
  stored: StoredProjectRecord;
  run: CheckRun;
  attachments: DocumentRef[];
  documents: PacketDocuments;
  preflight: Preflight;
}

/** The same reading the generation starts from, so the designer's list and the packet's cover agree. */
export function buildPreflight(ctx: ServiceContext, projectId: string): PreflightParts {
  const stored = getProjectRecord(ctx, projectId);
  const { record } = stored;
  const run = runChecks(record);
  const attachments: DocumentRef[] = listProjectAttachments(ctx, projectId);
  const documents = selectPacketDocuments(record, attachments);
  const required = stored.jurisdictionId ? record.jurisdiction.requiredDocuments : [...DEFAULT_REQUIRED_DOCUMENTS];
  const missingDocs = missingDocuments(record, attachments, required);
  const failingChecks = run.results
    .filter((r) => r.status === "fail" || r.status === "needs-input")
    .map((r) => ({ id: r.id, checkId: r.checkId, title: r.title, subject: r.subject ?? null, status: r.status, message: r.message }));
  const labels = requiredLabels(record, run.edition);
  const missingLabels = labels.map(labelGap).filter((g): g is string => g !== undefined);
  const reasons = packetDraftReasons(record, run, labels, missingDocs);
  const preflight: Preflight = {
    projectId: stored.projectId,
    projectName: record.name,
    jurisdictionName: record.jurisdiction.name,
    defaultDocuments: !stored.jurisdictionId,
    requiredDocuments: required.map((id) => ({ id, label: REQUIRED_DOCUMENT_LABELS[id] })),
    missingDocuments: missingDocs,
    failingChecks,
    counts: run.counts,
    edition: run.edition,
    missingLabels,
    documents: [...(documents.sitePlan ? [documents.sitePlan] : []), ...documents.merged].map((d) => ({
      id: d.id,
      kind: d.kind,
      fileName: d.fileName,
      equipmentTag: d.equipmentTag,
    })),
    isDraft: reasons.length > 0,
    draftReasons: reasons,
  };
  return { stored, run, attachments, documents, preflight };
}

/** What the packet would lack if generated now: missing documents, failing checks, incomplete labels. */
export function preflightPacket(ctx: ServiceContext, projectId: string): Preflight {
  requirePermission(ctx, "project:read", "read projects");
  return buildPreflight(ctx, projectId).preflight;
}
