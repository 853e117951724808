import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { parseMarkup } from "@/lib/packet/markup";
import { templateContext } from "@/lib/packet/context";
import { SHEET_PLAN } from "@/lib/packet/model";
import { DEFAULT_TEMPLATE_DIR, TEMPLATE_CONTEXT_SHAPE, renderSheetTemplate, validateTemplate, type Shape } from "@/lib/packet/templates";
import { SHEET_TEMPLATE_NAMES } from "@/lib/packet/types";
import { fixtureInput } from "./fixtures";

describe("validateTemplate", () => {
  it("accepts every shipped sheet template", () => {
    for (const name of SHEET_TEMPLATE_NAMES) {
      const source = fs.readFileSync(`${DEFAULT_TEMPLATE_DIR}/${name}.hbs`, "utf8");
      expect(validateTemplate(name, source), name).toEqual({ ok: true });
    }
  });

  it("names the line of a syntax error", () => {
    const result = validateTemplate("cover", "# Cover\n\nProject :: {{project.name\n");
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.line).toBe(3);
      expect(result.message).toMatch(/syntax error/);
    }
  });

  it("names the line of a block closed by the wrong helper", () => {
    const result = validateTemplate("general-notes", "one\n{{#if flags.hasBattery}}\nbatteries\n{{/each}}\n");
    expect(result).toMatchObject({ ok: false, line: 2 });
  });

  it("names an unknown variable and its line", () => {
    const result = validateTemplate("general-notes", "# Notes\nAHJ :: {{jurisdiction.name}}\nParcel :: {{project.parcelNumber}}\n");
    expect(result).toEqual({ ok: false, line: 3, name: "project.parcelNumber", message: 'line 3: unknown variable "project.parcelNumber"' });
  });

  it("resolves variables inside #each against the list item, and ../ against the outer scope", () => {
    expect(validateTemplate("cover", "{{#each sheets}}\n| {{code}} | {{title}} | {{../project.name}} | {{@index}} |\n{{/each}}")).toEqual({ ok: true });
    expect(validateTemplate("cover", "{{#each sheets}}\n{{code}}\n{{titel}}\n{{/each}}")).toMatchObject({ ok: false, line: 3, name: "titel" });
    expect(validateTemplate("cover", "{{#each project.name}}{{/each}}")).toMatchObject({ ok: false, name: "project.name" });
  });

  it("accepts the approval's fields only where the revision is known to be approved", () => {
    expect(validateTemplate("cover", "Stamped by {{approval.reviewerName}}")).toMatchObject({ ok: false, line: 1, name: "approval.reviewerName" });
    expect(validateTemplate("cover", "{{#if approved}}\nStamped by {{approval.reviewerName}}\n{{/if}}")).toEqual({ ok: true });
    expect(validateTemplate("cover", "{{#with approval}}{{licenceNumber}}{{/with}}")).toEqual({ ok: true });
    expect(validateTemplate("cover", "{{#if approved}}{{#each sheets}}{{../approval.licenceNumber}}{{/each}}{{/if}}")).toEqual({ ok: true });
    expect(validateTemplate("cover", "{{#if approved}}yes{{else}}\n{{approval.approvedAt}}{{/if}}")).toMatchObject({ ok: false, line: 2 });
  });

  it("refuses unknown helpers and partials", () => {
    expect(validateTemplate("cover", "x\n{{shout project.name}}")).toMatchObject({ ok: false, line: 2, name: "shout" });
    expect(validateTemplate("cover", "{{> letterhead}}")).toMatchObject({ ok: false, line: 1 });
    expect(validateTemplate("cover", '{{#if (eq jurisdiction.necEdition "2023")}}new{{/if}}')).toEqual({ ok: true });
  });

  it("refuses a name that is not a sheet template", () => {
    expect(validateTemplate("invoice", "")).toMatchObject({ ok: false });
  });
});

describe("template context", () => {
  function keysOf(value: unknown, shape: Shape, path: string, problems: string[]) {
    if (shape === "s") {
      if (typeof value !== "string") problems.push(`${path}: expected text, got ${typeof value}`);
    } else if (shape === "b") {
      if (typeof value !== "boolean") problems.push(`${path}: expected yes/no`);
    } else if (Array.isArray(shape)) {
      if (!Array.isArray(value)) problems.push(`${path}: expected a list`);
      else value.forEach((v, i) => keysOf(v, (shape as readonly [Shape])[0], `${path}.${i}`, problems));
    } else {
      if (value === null) return;
      const obj = value as Record<string, unknown>;
      for (const k of Object.keys(shape)) {
        if (!(k in obj)) problems.push(`${path}.${k}: missing`);
        else keysOf(obj[k], (shape as Record<string, Shape>)[k]!, `${path}.${k}`, problems);
      }
      for (const k of Object.keys(obj)) if (!(k in shape)) problems.push(`${path}.${k}: not declared`);
    }
  }

  it("supplies exactly the declared variables, with the declared kinds", () => {
    const input = fixtureInput({ reviewNotes: [{ target: "E-003", text: "Check C4", author: "IC" }] });
    const ctx = templateContext(input, SHEET_PLAN[0]!, new Map(), [], { isDraft: true, reasons: ["x"] });
    const problems: string[] = [];
    keysOf(ctx, TEMPLATE_CONTEXT_SHAPE, "context", problems);
    expect(problems).toEqual([]);
  });

  it("keeps substituted values out of the markup", () => {
    const input = fixtureInput();
    const ctx = templateContext({ ...input, record: { ...input.record, name: "Cabin | phase 2\n# not a heading" } }, SHEET_PLAN[0]!, new Map(), [], { isDraft: false, reasons: [] });
    const blocks = renderSheetTemplate("cover", ctx, "Project :: {{project.name}}");
    expect(blocks).toEqual([{ kind: "fields", rows: [["Project", "Cabin / phase 2 # not a heading"]] }]);
  });
});

describe("parseMarkup", () => {
  it("reads headings, paragraphs, lists, cautions, fields and tables", () => {
    const blocks = parseMarkup(
      [
        "# Title",
        "A paragraph",
        "that continues.",
        "",
        "- one",
        "- two",
        "1. first",
        "! Watch out",
        "! Second caution",
        "Key :: Value",
        "Other :: More",
        "| A | B |",
        "|---|---|",
        "| 1 | 2 |",
        "~~~",
      ].join("\n"),
    );
    expect(blocks).toEqual([
      { kind: "heading", level: 1, text: "Title" },
      { kind: "paragraph", text: "A paragraph that continues." },
      { kind: "list", ordered: false, items: ["one", "two", "first"] },
      { kind: "caution", text: "Watch out" },
      { kind: "caution", text: "Second caution" },
      { kind: "fields", rows: [["Key", "Value"], ["Other", "More"]] },
      { kind: "table", columns: [{ header: "A", weight: 1 }, { header: "B", weight: 1 }], rows: [["1", "2"]] },
      { kind: "column-break" },
    ]);
  });

  it("takes a table's column widths from the dashes of its header separator", () => {
    const [table] = parseMarkup(["| Rev | What changed |", "|---|------------|", "| 1 | First issue |"].join("\n"));
    expect(table).toEqual({ kind: "table", columns: [{ header: "Rev", weight: 1 }, { header: "What changed", weight: 4 }], rows: [["1", "First issue"]] });
  });
});
