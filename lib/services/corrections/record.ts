import "server-only";
import { correctionItems } from "../../../db/schema";
import type { CorrectionItem } from "../../schemas/corrections";
import type { Tx } from "../submissions/shared";

/** Writes a letter's comments as items, numbered as the letter numbers them; called inside the event's transaction. */
export function insertCorrectionItems(
  tx: Tx,
  rows: { orgId: string; projectId: string; submissionId: string; eventId: string; assigneeId: string | null; createdAt: string },
  items: readonly CorrectionItem[],
): number {
  items.forEach((item, i) => {
    tx.insert(correctionItems)
      .values({ ...rows, number: i + 1, comment: item.comment, citation: item.citation, sheet: item.sheet })
      .run();
  });
  return items.length;
}
