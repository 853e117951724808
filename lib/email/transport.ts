import nodemailer, { type Transporter } from "nodemailer";
import { env } from "../env";

let cached: Transporter | undefined;

/** The SMTP transport from the environment: the local stand-in by default, a real server when SMTP_* say so. */
export function mailTransport(): Transporter {
  if (!cached) {
    const e = env();
    cached = nodemailer.createTransport({
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      auth: e.SMTP_USER ? { user: e.SMTP_USER, pass: e.SMTP_PASSWORD ?? "" } : undefined,
      // The stand-in speaks plain SMTP on loopback; a real server negotiates TLS itself.
      ignoreTLS: !e.SMTP_SECURE && (e.SMTP_HOST === "127.0.0.1" || e.SMTP_HOST === "localhost"),
      connectionTimeout: 5000,
      greetingTimeout: 5000,
    });
  }
  return cached;
}
