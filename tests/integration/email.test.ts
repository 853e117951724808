import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { SMTPServer } from "smtp-server";
import { outbox } from "../../db/schema";
import { startFakeSmtp } from "../../scripts/fake-smtp";
import { makeOrg, tempDatabase } from "./factories";

const mailDir = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-mail-"));
const port = 2700 + Math.floor(Math.random() * 200);
process.env.SMTP_PORT = String(port);
process.env.SMTP_HOST = "127.0.0.1";

const env = tempDatabase();
let server: SMTPServer;
beforeAll(async () => {
  server = await startFakeSmtp({ port, host: "127.0.0.1", dir: mailDir, quiet: true });
});
afterAll(async () => {
  await new Promise<void>((resolve) => server.close(() => resolve()));
  env.cleanup();
  fs.rmSync(mailDir, { recursive: true, force: true });
});

describe("e-mail through the outbox", () => {
  it("records the message, delivers it over SMTP and marks it sent", async () => {
    const { queueEmail, deliverQueued } = await import("../../lib/email/outbox");
    const org = makeOrg(env.db);
    const id = queueEmail(env.db, org.id, "reviewer@example.test", "sent-for-review", {
      reviewerName: "R. Reviewer",
      designerName: "D. Designer",
      projectName: "Test Cabin",
      address: "1 Test Lane",
      revisionNumber: 2,
      failCount: 0,
      warningCount: 1,
      needsInputCount: 0,
      attestCount: 3,
      projectId: "p1",
      revisionId: "r1",
    });
    const queued = env.db.select().from(outbox).where(eq(outbox.id, id)).get();
    expect(queued?.status).toBe("queued");
    expect(queued?.subject).toBe("For review: Test Cabin — packet revision 2");

    expect(await deliverQueued(env.db, org.id)).toEqual({ sent: 1, failed: 0 });
    const sent = env.db.select().from(outbox).where(eq(outbox.id, id)).get();
    expect(sent?.status).toBe("sent");
    const files = fs.readdirSync(mailDir);
    expect(files).toHaveLength(1);
    const eml = fs.readFileSync(path.join(mailDir, files[0]!), "utf8");
    expect(eml).toContain("reviewer@example.test");
    expect(eml).toMatch(/Subject: =\?UTF-8\?Q\?For_review/);
    expect(eml).toContain("1 Test Lane");
  });

  it("refuses to render a message with a missing value", async () => {
    const { renderEmail } = await import("../../lib/email/render");
    expect(() => renderEmail("permit-issued", { projectName: "X" })).toThrow(/jurisdictionName|permitNumber/);
  });
});
