/**
 * A local stand-in for the mail service: accepts every message on
 * SMTP_HOST:SMTP_PORT and keeps it as an .eml file under data/mail/, so the
 * demo and the tests hold a real SMTP conversation. Point SMTP_* at a real
 * server to replace it.
 */
import fs from "node:fs";
import path from "node:path";
import { SMTPServer } from "smtp-server";
import { env, resolvePath } from "../lib/env";

export function startFakeSmtp(options: { port?: number; host?: string; dir?: string; quiet?: boolean } = {}) {
  const port = options.port ?? env().SMTP_PORT;
  const host = options.host ?? env().SMTP_HOST;
  const dir = options.dir ?? resolvePath(process.env.MAIL_DIR ?? "data/mail");
  fs.mkdirSync(dir, { recursive: true });
  let count = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        count += 1;
        const name = `${new Date().toISOString().replace(/[:.]/g, "-")}-${count}.eml`;
        fs.writeFileSync(path.join(dir, name), Buffer.concat(chunks));
        if (!options.quiet) console.log(`[fake-smtp] ${session.envelope.rcptTo.map((r) => r.address).join(", ")} → ${name}`);
        callback();
      });
    },
  });
  return new Promise<SMTPServer>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => {
      if (!options.quiet) console.log(`[fake-smtp] listening on ${host}:${port}, keeping mail in ${dir}`);
      resolve(server);
    });
  });
}

if (process.argv[1] && path.resolve(process.argv[1]).endsWith(path.join("scripts", "fake-smtp.ts"))) {
  startFakeSmtp().catch((error) => {
    console.error(`[fake-smtp] could not start: ${error.message}`);
    process.exit(1);
  });
}
