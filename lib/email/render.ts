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
] as const;
export type EmailTemplate = (typeof EMAIL_TEMPLATES)[number];

const compiled = new Map<string, Handlebars.TemplateDelegate>();

/**
 * Renders templates/email/<name>.hbs. The first line of a template is
 * `Subject: …`; the rest is the plain-text body. Strict, so a missing value
 * is an error rather than a blank in a message to a client or an AHJ.
 */
export function renderEmail(name: EmailTemplate, vars: Record<string, unknown>): { subject: string; text: string } {
  let template = compiled.get(name);
  if (!template) {
    const file = path.join(process.cwd(), "templates", "email", `${name}.hbs`);
    template = Handlebars.compile(fs.readFileSync(file, "utf8"), { strict: true, noEscape: true });
    compiled.set(name, template);
  }
  const out = template(vars);
  const [first, ...rest] = out.split("\n");
  const subject = first?.startsWith("Subject:") ? first.slice("Subject:".length).trim() : name;
  return { subject, text: rest.join("\n").trim() + "\n" };
}
