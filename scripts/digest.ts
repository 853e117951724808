/**
 * `npm run digest`: the permit office's daily digest of overdue submissions
 * and expiring permits, for every organisation, sent once a day (a second run
 * the same UTC day sends nothing). A scheduler calls it each morning; the
 * submissions page has a button that sends it at any time.
 */
import { and, asc, eq } from "drizzle-orm";
import { openDatabase } from "../db/client";
import { organisations, userRoles, users } from "../db/schema";
import { deliverQueued } from "../lib/email/outbox";
import { env, resolvePath } from "../lib/env";
import { contextForUser } from "../lib/services/context";
import { sendOverdueDigest } from "../lib/services/submissions/digest";

async function main() {
  const db = openDatabase(resolvePath(env().DATABASE_PATH));
  try {
    for (const org of db.select().from(organisations).all()) {
      // The digest goes out in the name of the organisation's first active permit-office user.
      const office = db
        .select({ id: users.id })
        .from(users)
        .innerJoin(userRoles, and(eq(userRoles.userId, users.id), eq(userRoles.role, "office")))
        .where(and(eq(users.orgId, org.id), eq(users.active, true)))
        .orderBy(asc(users.createdAt))
        .get();
      if (!office) {
        console.log(`${org.name}: no active permit-office user; no digest.`);
        continue;
      }
      const sent = await sendOverdueDigest(contextForUser(db, office.id), { onceADay: true, deliver: deliverQueued });
      console.log(`${org.name}: ${sent.message}`);
    }
  } finally {
    db.$client.close();
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 1;
});
