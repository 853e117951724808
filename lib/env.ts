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
  /** Where background jobs queue: the database file (one machine) or Redis via BullMQ (workers on many machines). */
  JOBS_BACKEND: z.enum(["sqlite", "bullmq"]).default("sqlite"),
  REDIS_URL: z.string().url().default("redis://127.0.0.1:6379"),
  /**
   * "spawn": the web server starts one worker process beside itself (one machine, nothing else to run);
   * "external": workers are started apart with `npm run worker`, here or on other machines.
   */
  JOBS_WORKER: z.enum(["spawn", "external"]).default("spawn"),
  /** Packets rendered at once per worker; each takes a core while it runs. */
  JOBS_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(2),
  /** A packet of hundreds of pages renders in well under a minute; five leaves room on a busy machine. */
  JOBS_TIME_LIMIT_S: z.coerce.number().int().min(1).default(300),
  /** A worker that stops renewing its claim for this long is taken for dead and its job runs again. */
  JOBS_LEASE_S: z.coerce.number().int().min(1).default(30),
  JOBS_BACKOFF_S: z.coerce.number().min(0).default(2),
  /** Where uploads live: the UPLOADS_DIR folder, or an S3 bucket (needed once workers run on several machines). */
  STORAGE_BACKEND: z.enum(["disk", "s3"]).default("disk"),
  S3_BUCKET: z.string().optional(),
  /** An S3-compatible endpoint; leave unset for AWS. */
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default("us-east-1"),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  S3_PREFIX: z.string().default(""),
  S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).optional(),
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
