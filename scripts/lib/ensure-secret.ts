import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/**
 * Next.js and Auth.js read AUTH_SECRET from .env.local. A fresh clone has
 * none, so the first run writes a random one there (git-ignored).
 */
export function ensureAuthSecret(root = process.cwd()): void {
  if (process.env.AUTH_SECRET) return;
  const file = path.join(root, ".env.local");
  const existing = fs.existsSync(file) ? fs.readFileSync(file, "utf8") : "";
  const match = existing.match(/^AUTH_SECRET=(.+)$/m);
  if (match) {
    process.env.AUTH_SECRET = match[1];
    return;
  }
  const secret = randomBytes(32).toString("base64url");
  fs.writeFileSync(file, `${existing}${existing && !existing.endsWith("\n") ? "\n" : ""}AUTH_SECRET=${secret}\n`);
  process.env.AUTH_SECRET = secret;
}
