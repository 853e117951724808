/**
 * npm run check -- <project-file.json> [--json] [--edition 2017|2020|2023]
 *
 * Runs Sundocket's checks on a project file. Exit 0 when nothing fails, 1 when
 * a check fails, 2 when the file cannot be read or is not a valid project file
 * (every invalid field is named). The JSON output is exactly what runChecks
 * returns. The results are an aid: the licensed reviewer and the AHJ decide.
 */
import { readFileSync } from "node:fs";
import { parseProjectFile, runChecks, type CheckResult } from "../lib/compliance/index";
import { NEC_EDITIONS, type NecEdition } from "../lib/schemas/project-record";

const USAGE = "usage: npm run check -- <project-file.json> [--json] [--edition 2017|2020|2023]";

/**
 * Ends the run with an exit code without process.exit(): on a pipe, stdout drains asynchronously once the pipe's
 * buffer (64 KiB on Linux) is full, and process.exit() would cut the output there. Setting process.exitCode lets
 * Node exit by itself after the last write has drained.
 */
class CliExit extends Error {
  constructor(readonly code: number) {
    super(`exit ${code}`);
  }
}

function exitWith(code: number, lines: string[], stream: NodeJS.WriteStream = process.stderr): never {
  stream.write(lines.join("\n") + "\n");
  throw new CliExit(code);
}

function parseArgs(argv: string[]): { file: string; json: boolean; edition?: NecEdition } {
  let file: string | undefined;
  let json = false;
  let edition: NecEdition | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === "--json") json = true;
    else if (a === "--edition" || a.startsWith("--edition=")) {
      const value = a.includes("=") ? a.slice(a.indexOf("=") + 1) : argv[++i];
      if (!value || !(NEC_EDITIONS as readonly string[]).includes(value)) exitWith(2, [`--edition must be one of ${NEC_EDITIONS.join(", ")}`, USAGE]);
      edition = value as NecEdition;
    } else if (a === "--help" || a === "-h") exitWith(0, [USAGE], process.stdout);
    else if (a.startsWith("--")) exitWith(2, [`unknown option ${a}`, USAGE]);
    else if (file === undefined) file = a;
    else exitWith(2, [`unexpected argument ${a}`, USAGE]);
  }
  if (file === undefined) exitWith(2, [USAGE]);
  return { file, json, ...(edition ? { edition } : {}) };
}

const SHAPES: Record<CheckResult["status"], string> = {
  fail: "✖ FAIL",
  "needs-input": "? NEEDS INPUT",
  warning: "▲ WARNING",
  attest: "◆ ATTEST",
  pass: "✔ PASS",
  "not-applicable": "– N/A",
};

function pad(s: string, n: number): string {
  return s.length >= n ? s : s + " ".repeat(n - s.length);
}

function main(): void {
  const args = parseArgs(process.argv.slice(2));
  let text: string;
  try {
    text = readFileSync(args.file, "utf8");
  } catch (e) {
    exitWith(2, [`cannot read ${args.file}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`]);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    exitWith(2, [`${args.file} is not valid JSON: ${(e as Error).message}`]);
  }
  const parsed = parseProjectFile(json);
  if (!parsed.ok) {
    if (args.json) {
      process.stdout.write(JSON.stringify({ ok: false, issues: parsed.issues }, null, 2) + "\n");
      throw new CliExit(2);
    }
    exitWith(2, [`${args.file} is not a valid project file (${parsed.issues.length} problem${parsed.issues.length === 1 ? "" : "s"}):`, ...parsed.issues.map((i) => `  ${i.path}: ${i.message}`)]);
  }
  const run = runChecks(parsed.record, args.edition ? { edition: args.edition } : {});
  if (args.json) {
    process.stdout.write(JSON.stringify(run, null, 2) + "\n");
  } else {
    const r = parsed.record;
    const out: string[] = [];
    out.push(`${r.name} — ${r.jurisdiction.name}, NEC ${run.edition}${args.edition && args.edition !== r.jurisdiction.necEdition ? ` (adopted: ${r.jurisdiction.necEdition})` : ""}`);
    out.push("");
    const w = Math.min(44, Math.max(...run.results.map((x) => x.id.length), 10));
    out.push(`${pad("STATUS", 14)}  ${pad("CHECK", w)}  RESULT`);
    for (const x of run.results) {
      out.push(`${pad(SHAPES[x.status], 14)}  ${pad(x.id, w)}  ${x.message}`);
      if (x.status === "fail" || x.status === "needs-input") out.push(`${" ".repeat(16 + w)}  ${x.codeRefs.join("; ")}`);
    }
    out.push("");
    out.push(Object.entries(run.counts).map(([k, n]) => `${k} ${n}`).join(" · "));
    out.push("An aid for the designer and the licensed reviewer, not an approval: the AHJ and licensed practice decide.");
    process.stdout.write(out.join("\n") + "\n");
  }
  process.exitCode = run.counts.fail > 0 ? 1 : 0;
}

// A reader that stops early (`| head -c 1000`) closes the pipe; the rest of the output has nowhere to go.
process.stdout.on("error", (e: NodeJS.ErrnoException) => {
  if (e.code !== "EPIPE") throw e;
  process.exit(process.exitCode ?? 0);
});

try {
  main();
} catch (e) {
  if (!(e instanceof CliExit)) throw e;
  process.exitCode = e.code;
}
