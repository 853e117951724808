import { spawnSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { exampleJson, run } from "./fixtures";

const ROOT = path.resolve(__dirname, "../../..");
const TSX = path.join(ROOT, "node_modules/.bin/tsx");

function check(...args: string[]) {
  const r = spawnSync(TSX, ["scripts/check.ts", ...args], { cwd: ROOT, encoding: "utf8" });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe("npm run check", () => {
  it("prints exactly what runChecks returns with --json, exit 1 when a check fails", () => {
    const out = check("examples/tamarack-hut.json", "--json");
    expect(out.code).toBe(1);
    expect(JSON.parse(out.stdout)).toEqual(JSON.parse(JSON.stringify(run(exampleJson("tamarack-hut")))));
  });

  it("exits 0 when nothing fails, and follows --edition", () => {
    const out = check("examples/ferncliff-farmhouse.json", "--edition", "2017");
    expect(out.code).toBe(0);
    expect(out.stdout).toContain("NEC 2017 (adopted: 2023)");
    expect(out.stdout).toMatch(/not an approval/);
  });

  it("exits 2 naming every invalid field, and for bad JSON or a missing file", () => {
    const dir = tmpdir();
    const bad = exampleJson("market-stall");
    bad.site.designHighTempC = 99;
    bad.circuits[0].toTag = "NOPE";
    const file = path.join(dir, `sundocket-invalid-${process.pid}.json`);
    writeFileSync(file, JSON.stringify(bad));
    const out = check(file);
    expect(out.code).toBe(2);
    expect(out.stderr).toContain("site.designHighTempC: must be between -60 and 70 °C");
    expect(out.stderr).toContain('circuits.0.toTag: names no equipment or array: "NOPE"');
    const notJson = path.join(dir, `sundocket-not-json-${process.pid}.json`);
    writeFileSync(notJson, "{ nope");
    expect(check(notJson).code).toBe(2);
    expect(check(path.join(dir, "does-not-exist.json")).code).toBe(2);
    expect(check().code).toBe(2);
    // Five command runs, each starting tsx: on a busy machine that takes well over the default per-test time.
  }, 90_000);
});

describe("npm run check through a pipe", () => {
  it("writes the whole JSON of a 2,000-circuit project before exiting", () => {
    const json = exampleJson("tamarack-hut");
    const template = json.circuits.find((c: { kind: string }) => c.kind === "pv-source");
    for (let i = 0; i < 2000 - json.circuits.length + 1; i++) json.circuits.push({ ...template, tag: `PIPE-${i}` });
    const file = path.join(tmpdir(), `sundocket-large-${process.pid}.json`);
    writeFileSync(file, JSON.stringify(json));
    // A shell pipe into a slow reader: the output (tens of MB) is far beyond one pipe buffer (64 KiB on Linux).
    const r = spawnSync("sh", ["-c", `"${TSX}" scripts/check.ts "${file}" --json | (sleep 0.3; cat)`], {
      cwd: ROOT,
      encoding: "utf8",
      maxBuffer: 512 * 1024 * 1024,
    });
    expect(r.stdout.length).toBeGreaterThan(64 * 1024);
    expect(JSON.parse(r.stdout)).toEqual(JSON.parse(JSON.stringify(run(json))));

    // A reader that stops early is not an error of the check command: no stack trace, the check's own exit code.
    const early = spawnSync("bash", ["-c", `"${TSX}" scripts/check.ts "${file}" --json | head -c 1000 >/dev/null; echo "\${PIPESTATUS[0]}"`], {
      cwd: ROOT,
      encoding: "utf8",
    });
    expect(early.stderr).not.toContain("EPIPE");
    expect(early.stdout.trim()).toBe("1");
  }, 60_000);
});
