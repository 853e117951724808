import { describe, expect, it } from "vitest";
import { SHEET_PLAN, templateContext } from "@/lib/packet/model";
import { COMPILED_CACHE_MAX, compiledTemplateCount, renderSheetTemplate, TemplateError, TEMPLATE_LIMITS, validateTemplate } from "@/lib/packet/templates";
import { fixtureInput } from "./fixtures";

/**
 * A jurisdiction's office staff write sheet templates; a template must not be
 * able to hold the server, however its loops are written.
 */

const nestedEach = (depth: number) => "{{#each @root.sheets}}".repeat(depth) + "x" + "{{/each}}".repeat(depth);

function bigContext(listLength: number) {
  const input = fixtureInput();
  const ctx = templateContext(input, SHEET_PLAN[0]!, new Map(), [], { isDraft: true, reasons: ["x"] }) as Record<string, unknown>;
  ctx.sheets = Array.from({ length: listLength }, (_, i) => ({ code: `E-${i}`, title: "Sheet", pages: "1" }));
  return ctx;
}

describe("sheet template bounds at validation", () => {
  it("refuses #each nested three deep over the root lists, naming the line", () => {
    const result = validateTemplate("cover", `# Cover\n${nestedEach(3)}`);
    expect(result).toMatchObject({ ok: false, line: 2 });
    if (!result.ok) expect(result.message).toContain("looped more than 2 deep");
  });

  it("accepts a list inside a list (the sheets of each code, say)", () => {
    expect(validateTemplate("cover", nestedEach(2))).toEqual({ ok: true });
  });

  it("refuses blocks nested past the block depth", () => {
    const deep = "{{#if approved}}".repeat(TEMPLATE_LIMITS.blockDepth + 1) + "x" + "{{/if}}".repeat(TEMPLATE_LIMITS.blockDepth + 1);
    expect(validateTemplate("cover", deep)).toMatchObject({ ok: false });
    const fits = "{{#if approved}}".repeat(TEMPLATE_LIMITS.blockDepth) + "x" + "{{/if}}".repeat(TEMPLATE_LIMITS.blockDepth);
    expect(validateTemplate("cover", fits)).toEqual({ ok: true });
  });

  it("refuses a source over the size bound before parsing it", () => {
    const result = validateTemplate("general-notes", "a".repeat(TEMPLATE_LIMITS.sourceChars + 1));
    expect(result).toMatchObject({ ok: false, line: 1 });
    if (!result.ok) expect(result.message).toContain("at most 32 KB");
  });

  it("does not follow prototype keys as template variables", () => {
    expect(validateTemplate("cover", "{{project.constructor}}")).toMatchObject({ ok: false, name: "project.constructor" });
    expect(validateTemplate("cover", "{{hasOwnProperty project.name}}")).toMatchObject({ ok: false, name: "hasOwnProperty" });
  });
});

describe("sheet template bounds at render", () => {
  it("stops a loop whose work passes the iteration budget, quickly", () => {
    // 400 × 400 = 160 000 loop bodies, past the budget of 100 000.
    const started = Date.now();
    expect(() => renderSheetTemplate("cover", bigContext(400), nestedEach(2))).toThrow(TemplateError);
    expect(() => renderSheetTemplate("cover", bigContext(400), nestedEach(2))).toThrow(/loops ran more than 100000 times/);
    expect(Date.now() - started).toBeLessThan(TEMPLATE_LIMITS.renderMs * 2);
  });

  it("stops a render past its time limit", () => {
    expect(() => renderSheetTemplate("cover", bigContext(300), nestedEach(2) + "{{join sheets}}".repeat(50), undefined, { renderMs: 0 })).toThrow(/took longer than/);
  });

  it("stops a sheet whose text passes the output bound", () => {
    const wide = "{{#each @root.sheets}}{{#each @root.sheets}}" + "{{@root.project.name}} ".repeat(200) + "{{/each}}{{/each}}";
    expect(() => renderSheetTemplate("cover", bigContext(300), wide)).toThrow(/more than 2 MB of text/);
  });

  it("renders the same nesting over a packet-sized list", () => {
    const blocks = renderSheetTemplate("cover", bigContext(20), `# Index\n${nestedEach(2)}`);
    expect(blocks.length).toBeGreaterThan(0);
  });

  it("keeps at most COMPILED_CACHE_MAX compiled templates", () => {
    const ctx = bigContext(1);
    for (let i = 0; i < COMPILED_CACHE_MAX + 20; i += 1) renderSheetTemplate("cover", ctx, `# Cover ${i}\n{{project.name}}`);
    expect(compiledTemplateCount()).toBeLessThanOrEqual(COMPILED_CACHE_MAX);
  });
});
