import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/**
 * Next.js reads its environment from .env.local. A fresh clone has no
 * secrets, so the first run writes random ones there (git-ignored); a real
 * deployment sets its own.
 */
function ensureSecret(name: string, make: () => string, root: string): void {
  if (process.env[name]) return;
  const file = path.join(root, ".env.local");
  const existing = fs.existsSync(file) ? fs.readFileSync(file, "utf8") : "";
  const match = existing.match(new RegExp(`^${name}=(.+)$`, "m"));
  if (match) {
    process.env[name] = match[1];
    return;
  }
  const secret = make();
  fs.writeFileSync(file, `${existing}${existing && !existing.endsWith("\n") ? "\n" : ""}${name}=${secret}\n`);
  process.env[name] = secret;
}

/** Signs session tokens (Auth.js). */
export function ensureAuthSecret(root = process.cwd()): void {
  ensureSecret("AUTH_SECRET", () => randomBytes(32).toString("base64url"), root);
}

/** Seals reviewers' signing certificates at rest (AES-256-GCM wants 32 bytes). */
export function ensureCertificateKey(root = process.cwd()): void {
  ensureSecret("CERTIFICATE_KEY", () => randomBytes(32).toString("base64"), root);
}

/** Every secret the app reads from .env.local. */
export function ensureSecrets(root = process.cwd()): void {
  ensureAuthSecret(root);
  ensureCertificateKey(root);
}
