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
  firm: { name: S, preparedBy: S },
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

const env = Handlebars.create();
for (const [name, fn] of Object.entries(HELPERS)) env.registerHelper(name, fn);

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
    if (!isObjectShape(current) || !(part in current)) {
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
  if (!(name in HELPERS) && !BLOCK_HELPERS.has(name)) {
    throw new UnknownVariable(name, callee.loc?.start.line ?? 1, `unknown helper "${name}"`);
  }
  for (const param of params) checkExpression(param, stack);
  for (const pair of hash?.pairs ?? []) checkExpression(pair.value, stack);
}

function walk(node: Node, stack: Scope[]): void {
  switch (node.type) {
    case "Program":
      for (const child of (node as hbs.AST.Program).body) walk(child, stack);
      return;
    case "MustacheStatement": {
      const m = node as hbs.AST.MustacheStatement;
      if (m.path.type !== "PathExpression") return;
      const p = m.path as hbs.AST.PathExpression;
      if (m.params.length > 0 || (m.hash?.pairs.length ?? 0) > 0) checkCall(p, m.params, m.hash, stack);
      else if (!p.data && p.parts.length === 1 && p.original in HELPERS) return;
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
      if (b.program) walk(b.program, inner);
      if (b.inverse) walk(b.inverse, stack);
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

const compiled = new Map<string, Handlebars.TemplateDelegate>();

export class TemplateError extends Error {
  constructor(
    readonly template: string,
    readonly line: number,
    message: string,
  ) {
    super(`template ${template}, line ${line}: ${message}`);
  }
}

/** Renders a sheet template (or its override) to markup blocks. */
export function renderSheetTemplate(
  name: SheetTemplateName,
  context: TemplateContext,
  override?: string,
  dir = DEFAULT_TEMPLATE_DIR,
): Block[] {
  const source = override ?? loadTemplateSource(name, dir);
  let template = compiled.get(source);
  if (!template) {
    const check = validateTemplate(name, source);
    if (!check.ok) throw new TemplateError(name, check.line, check.message);
    template = env.compile(source, { strict: true, noEscape: true });
    compiled.set(source, template);
  }
  try {
    return parseMarkup(template(sanitise(context)));
  } catch (error) {
    const e = error as Error & { lineNumber?: number };
    throw new TemplateError(name, e.lineNumber ?? 1, e.message);
  }
}
