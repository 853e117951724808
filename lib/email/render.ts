import fs from "node:fs";
import path from "node:path";
import Handlebars from "handlebars";

export const EMAIL_TEMPLATES = [
  "sent-for-review",
  "returned",
  "approved",
  "submitted",
  "corrections-requested",
  "permit-issued",
  "ready-to-submit",
  "plan-review-started",
  "inspection-result",
  "submission-cancelled",
  "checklist-complete",
  "overdue-digest",
] as const;
export type EmailTemplate = (typeof EMAIL_TEMPLATES)[number];

const compiled = new Map<string, { subject: Handlebars.TemplateDelegate; body: Handlebars.TemplateDelegate }>();

/** Line breaks and other control characters: a value typed into a project name must not end the subject and start the body. */
const CONTROL_CHARACTERS = /[\u0000-\u001f\u007f\u0085\u2028\u2029]+/g;

/** A subject as one line of text, whatever the values put into it held. */
export function oneLineSubject(text: string): string {
  return text.replace(CONTROL_CHARACTERS, " ").replace(/ {2,}/g, " ").trim();
}

/**
 * Renders templates/email/<name>.hbs. The first line of a template is
 * `Subject: …`; the rest is the plain-text body. Strict, so a missing value
 * is an error rather than a blank in a message to a client or an AHJ. The
 * subject is rendered on its own and kept to one line.
 */
export function renderEmail(name: EmailTemplate, vars: Record<string, unknown>): { subject: string; text: string } {
  let template = compiled.get(name);
  if (!template) {
    const file = path.join(process.cwd(), "templates", "email", `${name}.hbs`);
    const source = fs.readFileSync(file, "utf8");
    const newline = source.indexOf("\n");
    const first = newline < 0 ? source : source.slice(0, newline);
    const subjectSource = first.startsWith("Subject:") ? first.slice("Subject:".length) : name;
    const bodySource = first.startsWith("Subject:") ? (newline < 0 ? "" : source.slice(newline + 1)) : source;
    template = {
      subject: Handlebars.compile(subjectSource, { strict: true, noEscape: true }),
      body: Handlebars.compile(bodySource, { strict: true, noEscape: true }),
    };
    compiled.set(name, template);
  }
  return { subject: oneLineSubject(template.subject(vars)), text: template.body(vars).trim() + "\n" };
}
