import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

/**
 * Every way into the server goes through one of two wrappers: route handlers
 * through defineRoute (lib/http.ts), server actions through defineAction
 * (lib/auth/action.ts). Each does the origin check, the session, the body
 * bound, the schema and the error mapping, so a handler written without one
 * would skip all five. These checks read the source, as a reviewer would.
 */

const ROOT = path.resolve(__dirname, "../../..");

function filesUnder(dir: string, accept: (file: string) => boolean): string[] {
  const out: string[] = [];
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) out.push(...filesUnder(full, accept));
    else if (accept(full)) out.push(full);
  }
  return out;
}

const rel = (file: string) => path.relative(ROOT, file);
const source = (file: string) => fs.readFileSync(file, "utf8");
/** Statements that start with `export`, one per line as the formatter writes them. */
const exportLines = (text: string) => text.split("\n").filter((line) => /^export\b/.test(line));

const routeFiles = filesUnder(path.join(ROOT, "app"), (f) => /[/\\]route\.tsx?$/.test(f));
const codeFiles = [...filesUnder(path.join(ROOT, "app"), (f) => /\.tsx?$/.test(f)), ...filesUnder(path.join(ROOT, "components"), (f) => /\.tsx?$/.test(f))];
const actionFiles = codeFiles.filter((f) => /^\s*["']use server["'];?\s*$/m.test(source(f).split("\n").slice(0, 3).join("\n")));

const HTTP_METHODS = "GET|HEAD|POST|PUT|PATCH|DELETE|OPTIONS";
/** Segment configuration a route file may also export (Next.js route segment config). */
const SEGMENT_CONFIG = /^export const (dynamic|dynamicParams|revalidate|fetchCache|runtime|preferredRegion|maxDuration) = /;

describe("route handlers", () => {
  it("finds the route handlers (the scan itself can fail)", () => {
    expect(routeFiles.length).toBeGreaterThanOrEqual(20);
  });

  it("export every method as defineRoute(...) and nothing else that handles a request", () => {
    const offenders: string[] = [];
    for (const file of routeFiles) {
      const text = source(file);
      for (const line of exportLines(text)) {
        if (new RegExp(`^export const (${HTTP_METHODS}) = defineRoute\\(`).test(line)) continue;
        if (SEGMENT_CONFIG.test(line)) continue;
        offenders.push(`${rel(file)}: ${line.trim()}`);
      }
      if (!/from "@\/lib\/http"/.test(text)) offenders.push(`${rel(file)}: does not import defineRoute`);
    }
    expect(offenders).toEqual([]);
  });
});

describe("server actions", () => {
  it("finds the action files", () => {
    expect(actionFiles.length).toBeGreaterThanOrEqual(6);
  });

  it("export every action as defineAction(...)", () => {
    const offenders: string[] = [];
    for (const file of actionFiles) {
      for (const line of exportLines(source(file))) {
        if (/^export const \w+ = defineAction\(/.test(line)) continue;
        // Types cost nothing at run time and cannot be called.
        if (/^export (type|interface) /.test(line)) continue;
        offenders.push(`${rel(file)}: ${line.trim()}`);
      }
    }
    expect(offenders).toEqual([]);
  });

  it("are never declared inline in a component, where no wrapper can reach them", () => {
    const inline = codeFiles.filter((f) => !actionFiles.includes(f) && /["']use server["']/.test(source(f))).map(rel);
    expect(inline).toEqual([]);
  });
});

describe("the session is resolved only by the wrappers", () => {
  it("no page, route or component asks for requireContext itself", () => {
    const offenders = codeFiles.filter((f) => /\brequireContext\b/.test(source(f))).map(rel);
    expect(offenders).toEqual([]);
  });
});

describe("one write path per operation", () => {
  it("creates submissions and records their events only through the office's actions, never a route", () => {
    const writers = routeFiles.filter((f) => /\b(createSubmission|recordSubmissionEvent|voidSubmissionEvent)\b/.test(source(f))).map(rel);
    expect(writers).toEqual([]);
    const actions = actionFiles.filter((f) => /\bcreateSubmission\b/.test(source(f))).map(rel);
    expect(actions).toEqual([path.join("app", "(app)", "submissions", "actions.ts")]);
  });
});
