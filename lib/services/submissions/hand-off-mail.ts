import "server-only";
import { queueEmail } from "../../email/outbox";
import { INSPECTION_LABELS, type EventKind } from "../../schemas/submission";
import type { ServiceContext } from "../context";
import type { EffectiveEvent } from "./events";
import { activeInstallers, type Tx } from "./shared";

interface HandOff {
  designer: { name: string; email: string } | undefined;
  submissionId: string;
  jurisdictionName: string;
  typicalReviewDays: number | null;
  projectName: string;
  referenceNumber: string;
  occurredOn: string;
  note: string;
  inspectionKind: string | undefined;
  permitNumber: string;
}

/** The permit number the application holds, for messages about its inspections. */
export function permitNumberOf(events: readonly EffectiveEvent[]): string {
  const permit = [...events].reverse().find((e) => e.kind === "permit-issued");
  return typeof permit?.data.permitNumber === "string" ? permit.data.permitNumber : "not recorded";
}

/**
 * Who is told of a submission event, beyond the corrections and permit mails
 * the event service sends itself: the designer when plan review starts; the
 * designer and installers of an inspection's result and of a cancellation.
 * Queued in the event's transaction; returns how many messages were queued.
 */
export function mailHandOff(tx: Tx, ctx: ServiceContext, kind: EventKind, h: HandOff): number {
  const to = new Map<string, string>();
  const designer = () => {
    if (h.designer) to.set(h.designer.email, h.designer.name);
  };
  const installers = () => {
    for (const i of activeInstallers(tx, ctx.orgId)) to.set(i.email, i.name);
  };
  let template: "plan-review-started" | "inspection-result" | "submission-cancelled" | null = null;
  let vars: Record<string, unknown> = {};
  const common = { submissionId: h.submissionId, jurisdictionName: h.jurisdictionName, projectName: h.projectName, occurredOn: h.occurredOn };
  if (kind === "in-plan-review") {
    designer();
    template = "plan-review-started";
    vars = { ...common, referenceNumber: h.referenceNumber, typicalReviewDays: h.typicalReviewDays ?? "" };
  } else if (kind === "inspection-passed" || kind === "inspection-failed") {
    designer();
    installers();
    template = "inspection-result";
    const label = h.inspectionKind && h.inspectionKind in INSPECTION_LABELS ? `${INSPECTION_LABELS[h.inspectionKind as keyof typeof INSPECTION_LABELS]} inspection` : "Inspection";
    vars = { ...common, inspectionLabel: label, outcome: kind === "inspection-passed" ? "passed" : "failed", permitNumber: h.permitNumber, note: h.note };
  } else if (kind === "cancelled") {
    designer();
    installers();
    template = "submission-cancelled";
    vars = { ...common, referenceNumber: h.referenceNumber, note: h.note };
  }
  if (!template) return 0;
  for (const email of to.keys()) queueEmail(tx, ctx.orgId, email, template, vars);
  return to.size;
}
