import fs from "node:fs";
import path from "node:path";
import Handlebars from "handlebars";
import { markupSafe, parseMarkup, type Block } from "./markup";
import { SHEET_TEMPLATE_NAMES, type SheetTemplateName } from "./types";

/**
 * Sheet templates: Handlebars producing the packet markup. Compiled in strict
 * mode so a variable the packet does not supply is an error, never a blank on
 * a sheet that goes to the permit counter.
 */

/** The variable contract: "s" a text value, "b" a yes/no flag, [shape] a list, {…} an object. */
export type Shape = "s" | "b" | readonly [Shape] | { readonly [key: string]: Shape };

const S = "s" as const;
const B = "b" as const;

/** Every sheet template receives the same context (documented in templates/packet/README.md). */
export const TEMPLATE_CONTEXT_SHAPE = {
  firm: { name: S, preparedBy: S, licence: S, contact: S },
  project: {
    name: S,
    client: S,
    address: S,
    systemKind: S,
    systemKindLabel: S,
    occupancy: S,
    occupancyLabel: S,
    mounting: S,
    batteryLocation: S,
    batteryLocationNote: S,
  },
  jurisdiction: {
    name: S,
    necEdition: S,
    residentialCode: S,
    voltageDropLimitPct: S,
    requiredDocuments: [S],
  },
  revision: { number: S, date: S, createdAt: S },
  revisions: [{ number: S, date: S, change: S, by: S }],
  sheet: { code: S, title: S, kind: S },
  sheets: [{ code: S, title: S, pages: S }],
  scope: [S],
  codes: [{ name: S, edition: S }],
  system: { moduleCount: S, arrayKwDc: S, storageKWh: S, inverterW: S, batteryUnits: S },
  site: {
    designLowTempC: S,
    designLowTempSource: S,
    designHighTempC: S,
    designHighTempSource: S,
    sunHoursPerDay: S,
  },
  counts: { total: S, pass: S, fail: S, warning: S, needsInput: S, attest: S, notApplicable: S },
  draft: { isDraft: B, reasons: [S] },
  flags: { hasPv: B, hasBattery: B, hasGenerator: B, onBuilding: B, standAlone: B, hybrid: B },
  approved: B,
  approval: {
    reviewerName: S,
    licenceNumber: S,
    licenceState: S,
    licenceDiscipline: S,
    approvedAt: S,
    recordSha256: S,
  },
  reviewNotes: [{ target: S, text: S, author: S }],
  labels: { count: S, list: [{ id: S, title: S, signalWord: S, codeRef: S, location: S, equipmentTag: S }] },
  attachments: { sitePlan: S, datasheets: [{ code: S, title: S, equipmentTag: S }] },
} as const satisfies Shape;

const HELPERS: Record<string, Handlebars.HelperDelegate> = {
  eq: (a: unknown, b: unknown) => a === b,
  ne: (a: unknown, b: unknown) => a !== b,
  not: (a: unknown) => !a,
  and: (...args: unknown[]) => args.slice(0, -1).every(Boolean),
  or: (...args: unknown[]) => args.slice(0, -1).some(Boolean),
  upper: (s: unknown) => String(s ?? "").toUpperCase(),
  /** `{{plural system.batteryUnits "unit" "units"}}` → "1 unit", "4 units". */
  plural: (n: unknown, one: unknown, many: unknown) => `${String(n)} ${Number(n) === 1 ? String(one) : String(many)}`,
  join: (list: unknown, sep: unknown) =>
    Array.isArray(list) ? list.join(typeof sep === "string" ? sep : ", ") : "",
};
const BLOCK_HELPERS = new Set(["if", "unless", "each", "with"]);

/**
 * Bounds on what a jurisdiction's template may ask of the server. The shipped
 * templates are under 3 KB, nest no list inside another and no block more than
 * three deep; each bound leaves room for a jurisdiction's own wording while a
 * template that loops every list inside every other list is refused when saved.
 */
export const TEMPLATE_LIMITS = {
  sourceChars: 32 * 1024,
  eachDepth: 2,
  blockDepth: 8,
  /** Loop bodies run while rendering one sheet: a packet's lists hold tens of items, so nesting two of them stays in the thousands. */
  renderIterations: 100_000,
  /** Markup one sheet may produce; a long general-notes sheet is about 10 KB. */
  outputChars: 2 * 1024 * 1024,
  /** Wall-clock time for one sheet; a shipped sheet renders in a few milliseconds. */
  renderMs: 2_000,
} as const;

const env = Handlebars.create();
for (const [name, fn] of Object.entries(HELPERS)) env.registerHelper(name, fn);

/** The work one render may still do; set for the length of a (synchronous) render. */
interface RenderBudget {
  iterations: number;
  outputChars: number;
  deadline: number;
}
let budget: RenderBudget | null = null;

class RenderBudgetExceeded extends Error {}

/**
 * Handlebars' own #each, with every loop body counted against the render's
 * budget: iterations, output and time, so a template cannot hold the server
 * however its loops are nested.
 */
const builtInEach = env.helpers.each as Handlebars.HelperDelegate;
env.registerHelper("each", function (this: unknown, context: unknown, options: Handlebars.HelperOptions) {
  const fn = options.fn;
  const counted = Object.assign((value: unknown, opts?: Handlebars.RuntimeOptions) => {
    const b = budget;
    if (b) {
      b.iterations -= 1;
      if (b.iterations < 0) throw new RenderBudgetExceeded(`its loops ran more than ${TEMPLATE_LIMITS.renderIterations} times`);
      if (Date.now() > b.deadline) throw new RenderBudgetExceeded(`it took longer than ${TEMPLATE_LIMITS.renderMs / 1000} s to render`);
    }
    const out = fn(value, opts);
    if (b) {
      b.outputChars -= out.length;
      if (b.outputChars < 0) throw new RenderBudgetExceeded(`it produced more than ${TEMPLATE_LIMITS.outputChars / 1024 / 1024} MB of text`);
    }
    return out;
  }, fn);
  return builtInEach.call(this, context, { ...options, fn: counted });
});

export const DEFAULT_TEMPLATE_DIR = path.join(process.cwd(), "templates", "packet");

const cache = new Map<string, string>();

export function loadTemplateSource(name: SheetTemplateName, dir = DEFAULT_TEMPLATE_DIR): string {
  const file = path.join(dir, `${name}.hbs`);
  let source = cache.get(file);
  if (source === undefined) {
    source = fs.readFileSync(file, "utf8");
    cache.set(file, source);
  }
  return source;
}

export type TemplateValidation = { ok: true } | { ok: false; line: number; message: string; name?: string };

interface Scope {
  shape: Shape;
  inEach: boolean;
  /** Inside {{#if approved}} / {{#if approval}}, where the approval's fields exist. */
  approvalGuarded: boolean;
}

/** Present only once a reviewer approves; the rest of the time it is empty and its fields do not exist. */
const APPROVAL_ONLY = "approval";

class UnknownVariable extends Error {
  constructor(
    readonly variable: string,
    readonly line: number,
    detail: string,
  ) {
    super(detail);
  }
}

function isObjectShape(s: Shape): s is { readonly [key: string]: Shape } {
  return typeof s === "object" && !Array.isArray(s);
}

type Node = hbs.AST.Node & { loc?: hbs.AST.SourceLocation };

function resolvePath(p: hbs.AST.PathExpression, stack: Scope[]): Shape {
  const line = p.loc?.start.line ?? 1;
  const top = stack[stack.length - 1]!;
  if (p.data) {
    const [head, ...rest] = p.parts;
    if (head === "root") {
      guardApproval(rest, top, p.original, line);
      return walkParts(stack[0]!.shape, rest, p.original, line);
    }
    if (top.inEach && ["index", "first", "last", "key"].includes(head ?? "")) return S;
    throw new UnknownVariable(p.original, line, `unknown variable "${p.original}"`);
  }
  const scope = stack[stack.length - 1 - p.depth];
  if (!scope) throw new UnknownVariable(p.original, line, `"${p.original}" climbs above the top of the template`);
  if (scope === stack[0]) guardApproval(p.parts, top, p.original, line);
  return walkParts(scope.shape, p.parts, p.original, line);
}

function guardApproval(parts: string[], current: Scope, original: string, line: number) {
  if (parts[0] === APPROVAL_ONLY && parts.length > 1 && !current.approvalGuarded) {
    throw new UnknownVariable(
      original,
      line,
      `"${original}" exists only on an approved revision; put it inside {{#if approved}} … {{/if}}`,
    );
  }
}

function walkParts(shape: Shape, parts: string[], original: string, line: number): Shape {
  let current = shape;
  for (const part of parts) {
    if (Array.isArray(current) && part === "length") {
      current = S;
      continue;
    }
    if (!isObjectShape(current) || !Object.hasOwn(current, part)) {
      throw new UnknownVariable(original, line, `unknown variable "${original}"`);
    }
    current = current[part]!;
  }
  return current;
}

function isApprovalPath(node: hbs.AST.Expression | undefined): boolean {
  if (!node || node.type !== "PathExpression") return false;
  const p = node as hbs.AST.PathExpression;
  const parts = p.data && p.parts[0] === "root" ? p.parts.slice(1) : p.parts;
  return parts.length === 1 && (parts[0] === "approved" || parts[0] === APPROVAL_ONLY);
}

function checkExpression(node: hbs.AST.Expression, stack: Scope[]): Shape | null {
  if (node.type === "PathExpression") return resolvePath(node as hbs.AST.PathExpression, stack);
  if (node.type === "SubExpression") {
    const sub = node as hbs.AST.SubExpression;
    checkCall(sub.path as hbs.AST.PathExpression, sub.params, sub.hash, stack);
    return S;
  }
  return null;
}

function checkCall(
  callee: hbs.AST.PathExpression,
  params: hbs.AST.Expression[],
  hash: hbs.AST.Hash | undefined,
  stack: Scope[],
) {
  const name = callee.original;
  if (!Object.hasOwn(HELPERS, name) && !BLOCK_HELPERS.has(name)) {
    throw new UnknownVariable(name, callee.loc?.start.line ?? 1, `unknown helper "${name}"`);
  }
  for (const param of params) checkExpression(param, stack);
  for (const pair of hash?.pairs ?? []) checkExpression(pair.value, stack);
}

function walk(node: Node, stack: Scope[], depth = 0): void {
  switch (node.type) {
    case "Program":
      for (const child of (node as hbs.AST.Program).body) walk(child, stack, depth);
      return;
    case "MustacheStatement": {
      const m = node as hbs.AST.MustacheStatement;
      if (m.path.type !== "PathExpression") return;
      const p = m.path as hbs.AST.PathExpression;
      if (m.params.length > 0 || (m.hash?.pairs.length ?? 0) > 0) checkCall(p, m.params, m.hash, stack);
      else if (!p.data && p.parts.length === 1 && Object.hasOwn(HELPERS, p.original)) return;
      else resolvePath(p, stack);
      return;
    }
    case "BlockStatement": {
      const b = node as hbs.AST.BlockStatement;
      const p = b.path as hbs.AST.PathExpression;
      const name = p.original;
      const line = p.loc?.start.line ?? 1;
      const top = stack[stack.length - 1]!;
      if (!BLOCK_HELPERS.has(name)) {
        throw new UnknownVariable(name, line, `unknown block helper "${name}" (use if, unless, each or with)`);
      }
      checkCall(p, b.params, b.hash, stack);
      if (depth + 1 > TEMPLATE_LIMITS.blockDepth) {
        throw new UnknownVariable(name, line, `blocks are nested more than ${TEMPLATE_LIMITS.blockDepth} deep`);
      }
      if (name === "each" && stack.filter((s) => s.inEach).length >= TEMPLATE_LIMITS.eachDepth) {
        throw new UnknownVariable(name, line, `lists are looped more than ${TEMPLATE_LIMITS.eachDepth} deep (an #each inside an #each inside an #each)`);
      }
      const arg = b.params[0];
      const argShape = arg ? checkExpression(arg, stack) : null;
      let inner = stack;
      if (name === "each") {
        if (!argShape || !Array.isArray(argShape)) {
          throw new UnknownVariable(arg && "original" in arg ? String(arg.original) : name, line, `#each needs a list`);
        }
        inner = [...stack, { shape: (argShape as readonly [Shape])[0], inEach: true, approvalGuarded: top.approvalGuarded }];
      } else if (name === "with") {
        if (!argShape || !isObjectShape(argShape)) {
          throw new UnknownVariable(arg && "original" in arg ? String(arg.original) : name, line, `#with needs an object`);
        }
        inner = [...stack, { shape: argShape, inEach: false, approvalGuarded: top.approvalGuarded || isApprovalPath(arg) }];
      } else if (name === "if" && isApprovalPath(arg)) {
        inner = [...stack.slice(0, -1), { ...top, approvalGuarded: true }];
      }
      if (b.program) walk(b.program, inner, depth + 1);
      if (b.inverse) walk(b.inverse, stack, depth + 1);
      return;
    }
    case "PartialStatement":
    case "PartialBlockStatement":
    case "DecoratorBlock":
    case "Decorator":
      throw new UnknownVariable("partial", node.loc?.start.line ?? 1, "partials and decorators are not available in sheet templates");
    default:
      return;
  }
}

/** Checks syntax and every variable and helper against the packet's template context. */
export function validateTemplate(name: SheetTemplateName | string, source: string): TemplateValidation {
  if (!(SHEET_TEMPLATE_NAMES as readonly string[]).includes(name)) {
    return { ok: false, line: 1, message: `no sheet template is called "${name}"` };
  }
  if (source.length > TEMPLATE_LIMITS.sourceChars) {
    return { ok: false, line: 1, message: `the template is ${Math.ceil(source.length / 1024)} KB; a sheet template may be at most ${TEMPLATE_LIMITS.sourceChars / 1024} KB` };
  }
  let ast: hbs.AST.Program;
  try {
    ast = env.parse(source);
  } catch (error) {
    const e = error as Error & { lineNumber?: number };
    const line = e.lineNumber ?? Number(/line (\d+)/.exec(e.message)?.[1] ?? 1);
    const first = e.message.split("\n")[0] ?? e.message;
    const expecting = /Expecting (.*)$/m.exec(e.message)?.[1];
    return { ok: false, line, message: `syntax error: ${first}${expecting ? ` (expecting ${expecting})` : ""}` };
  }
  try {
    walk(ast, [{ shape: TEMPLATE_CONTEXT_SHAPE, inEach: false, approvalGuarded: false }]);
  } catch (error) {
    if (error instanceof UnknownVariable) {
      return { ok: false, line: error.line, message: `line ${error.line}: ${error.message}`, name: error.variable };
    }
    throw error;
  }
  return { ok: true };
}

export type TemplateContext = Record<string, unknown>;

function sanitise(value: unknown): unknown {
  if (typeof value === "string") return markupSafe(value);
  if (Array.isArray(value)) return value.map(sanitise);
  if (value && typeof value === "object") {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, sanitise(v)]));
  }
  return value;
}

/**
 * Compiled templates by source, least recently used dropped first: every
 * jurisdiction may override every sheet, and each saved edit is a new source.
 */
export const COMPILED_CACHE_MAX = 64;
const compiled = new Map<string, Handlebars.TemplateDelegate>();

function compiledTemplate(name: SheetTemplateName, source: string): Handlebars.TemplateDelegate {
  const hit = compiled.get(source);
  if (hit) {
    compiled.delete(source);
    compiled.set(source, hit);
    return hit;
  }
  const check = validateTemplate(name, source);
  if (!check.ok) throw new TemplateError(name, check.line, check.message);
  const template = env.compile(source, { strict: true, noEscape: true });
  compiled.set(source, template);
  while (compiled.size > COMPILED_CACHE_MAX) compiled.delete(compiled.keys().next().value as string);
  return template;
}

/** How many compiled templates are held; for tests of the bound. */
export function compiledTemplateCount(): number {
  return compiled.size;
}

export class TemplateError extends Error {
  constructor(
    readonly template: string,
    readonly line: number,
    message: string,
  ) {
    super(`template ${template}, line ${line}: ${message}`);
  }
}

/** Renders a sheet template (or its override) to markup blocks, within TEMPLATE_LIMITS' iterations, output and time. */
export function renderSheetTemplate(
  name: SheetTemplateName,
  context: TemplateContext,
  override?: string,
  dir = DEFAULT_TEMPLATE_DIR,
  limits: { renderMs?: number } = {},
): Block[] {
  const source = override ?? loadTemplateSource(name, dir);
  const template = compiledTemplate(name, source);
  const outer = budget;
  budget = {
    iterations: TEMPLATE_LIMITS.renderIterations,
    outputChars: TEMPLATE_LIMITS.outputChars,
    deadline: Date.now() + (limits.renderMs ?? TEMPLATE_LIMITS.renderMs),
  };
  let text: string;
  try {
    text = template(sanitise(context));
  } catch (error) {
    if (error instanceof RenderBudgetExceeded) throw new TemplateError(name, 1, `the template was stopped: ${error.message}`);
    const e = error as Error & { lineNumber?: number };
    throw new TemplateError(name, e.lineNumber ?? 1, e.message);
  } finally {
    budget = outer;
  }
  if (text.length > TEMPLATE_LIMITS.outputChars) {
    throw new TemplateError(name, 1, `the template was stopped: it produced more than ${TEMPLATE_LIMITS.outputChars / 1024 / 1024} MB of text`);
  }
  try {
    return parseMarkup(text);
  } catch (error) {
    const e = error as Error & { lineNumber?: number };
    throw new TemplateError(name, e.lineNumber ?? 1, e.message);
  }
}
