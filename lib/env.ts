import path from "node:path";
import { z } from "zod";

/**
 * The environment, read and validated once. Every setting has a default that
 * runs the demo on one machine; a real deployment replaces the mail server,
 * storage folder and secret through these variables.
 */
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
  DATABASE_PATH: z.string().min(1).default("data/sundocket.db"),
  UPLOADS_DIR: z.string().min(1).default("uploads"),
  PACKETS_DIR: z.string().min(1).default("data/packets"),
  /** Largest accepted upload; datasheets run to a few MB, scanned site plans more. */
  UPLOAD_MAX_BYTES: z.coerce.number().int().positive().default(25 * 1024 * 1024),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().positive().default(2525),
  SMTP_SECURE: z
    .enum(["true", "false"])
    .default("false")
    .transform((v) => v === "true"),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default("Sundocket <no-reply@sundocket.test>"),
  APP_URL: z.string().url().default("http://localhost:3000"),
  /** Failed sign-ins before an account is locked, and for how long. */
  SIGNIN_MAX_FAILURES: z.coerce.number().int().min(1).default(5),
  SIGNIN_LOCK_MINUTES: z.coerce.number().int().min(1).default(15),
  /** 32 bytes in base64: seals reviewers' signing certificates at rest. Without it no certificate can be stored or used. */
  CERTIFICATE_KEY: z.string().optional(),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;
export function env(): Env {
  if (!cached) {
    const parsed = envSchema.safeParse(process.env);
    if (!parsed.success) {
      const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
      throw new Error(`Invalid environment:\n${lines}`);
    }
    cached = parsed.data;
  }
  return cached;
}

/** Resolves a configured path against the project root (the process's working directory). */
export function resolvePath(p: string): string {
  // Configured at run time; the build need not trace these folders.
  return path.isAbsolute(p) ? p : path.resolve(/*turbopackIgnore: true*/ process.cwd(), p);
}
