import { and, eq } from "drizzle-orm";
import type { Db } from "../../db/client";
import { outbox } from "../../db/schema";
import { env } from "../env";
import { oneLineSubject, renderEmail, withheldLinks, type EmailTemplate } from "./render";
import { mailTransport } from "./transport";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

/**
 * Writes a message to the outbox inside the caller's transaction, so the
 * hand-off and its e-mail are recorded together; delivery happens after
 * commit by a mail.deliver job (deliverQueued), and a failed delivery stays
 * visible in the outbox.
 */
export function queueEmail(
  tx: Tx | Db,
  orgId: string,
  to: string,
  template: EmailTemplate,
  vars: Record<string, unknown>,
): string {
  const { subject, text } = renderEmail(template, { appUrl: env().APP_URL, ...vars });
  return tx.insert(outbox).values({ orgId, toAddress: to, subject, bodyText: text, template }).returning({ id: outbox.id }).get().id;
}

export async function deliverQueued(db: Db, orgId: string): Promise<{ sent: number; failed: number }> {
  const queued = db.select().from(outbox).where(and(eq(outbox.orgId, orgId), eq(outbox.status, "queued"))).all();
  let sent = 0;
  let failed = 0;
  for (const message of queued) {
    try {
      const info = await mailTransport().sendMail({ from: env().MAIL_FROM, to: message.toAddress, subject: oneLineSubject(message.subject), text: message.bodyText });
      // Once sent, the kept copy no longer holds a working one-time link.
      const bodyText = withheldLinks(message.template, message.bodyText);
      db.update(outbox).set({ status: "sent", messageId: info.messageId, sentAt: new Date().toISOString(), error: null, bodyText }).where(eq(outbox.id, message.id)).run();
      sent += 1;
    } catch (error) {
      db.update(outbox).set({ status: "failed", error: (error as Error).message.slice(0, 500) }).where(eq(outbox.id, message.id)).run();
      failed += 1;
    }
  }
  return { sent, failed };
}
