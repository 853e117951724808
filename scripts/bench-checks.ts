/**
 * npm run bench:checks
 *
 * Times a full check run on generated projects of 20, 200 and 2,000 circuits
 * and prints the median of repeated runs with the cost per circuit. The aim:
 * a 200-circuit project well inside one animation frame (16 ms), and cost
 * growing linearly with the circuits.
 */
import { cpus, loadavg } from "node:os";
import { performance } from "node:perf_hooks";
import { parseProjectFile, runChecks } from "../lib/compliance/index";
import type { ProjectRecord } from "../lib/schemas/project-record";
import { generatedProject } from "./lib/generated-project";


function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

function main(): void {
  const sizes = [20, 200, 2000];
  const perSize = new Map<number, { med: number; cpu: number }>();
  const rows: string[][] = [["circuits", "results", "runs", "median ms", "µs / circuit", "cpu ms / run", "parse ms"]];
  for (const n of sizes) {
    const parsed = parseProjectFile(generatedProject(n));
    if (!parsed.ok) throw new Error(parsed.issues.map((i) => `${i.path}: ${i.message}`).join("\n"));
    const record: ProjectRecord = parsed.record;
    const runs = n >= 2000 ? 15 : 61;
    // Warm the JIT the way a live panel is warm after the first few keystrokes.
    for (let i = 0; i < (n >= 2000 ? 5 : 40); i++) runChecks(record);
    const times: number[] = [];
    let results = 0;
    const cpu0 = process.cpuUsage();
    for (let i = 0; i < runs; i++) {
      const t0 = performance.now();
      results = runChecks(record).results.length;
      times.push(performance.now() - t0);
    }
    const cpu = process.cpuUsage(cpu0);
    const cpuMsPerRun = (cpu.user + cpu.system) / 1000 / runs;
    const parseTimes: number[] = [];
    for (let i = 0; i < 5; i++) {
      const t0 = performance.now();
      parseProjectFile(generatedProject(n));
      parseTimes.push(performance.now() - t0);
    }
    const med = median(times);
    perSize.set(n, { med, cpu: cpuMsPerRun });
    rows.push([String(record.circuits.length), String(results), String(runs), med.toFixed(2), ((med * 1000) / record.circuits.length).toFixed(1), cpuMsPerRun.toFixed(2), median(parseTimes).toFixed(2)]);
  }
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((r) => r[c]!.length)));
  for (const [i, r] of rows.entries()) {
    process.stdout.write(r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!))).join("  ") + "\n");
    if (i === 0) process.stdout.write(widths.map((w) => "-".repeat(w)).join("  ") + "\n");
  }
  const small = perSize.get(200)!;
  const large = perSize.get(2000)!;
  process.stdout.write(
    `\n2,000 / 200 circuits: ${(large.med / small.med).toFixed(1)}× wall, ${(large.cpu / small.cpu).toFixed(1)}× CPU (aim ≤ 11×); ` +
      `200 circuits ${small.med.toFixed(1)} ms (aim ≤ 4 ms), 2,000 circuits ${large.med.toFixed(1)} ms (aim ≤ 40 ms), median wall.\n`,
  );
  const [load1] = loadavg();
  process.stdout.write(
    `\nmedian wall time of repeated full runChecks calls (after warm-up); cpu = this process's CPU time per run (less sensitive to a busy machine);\nparse = zod validation of the same project. Load average ${load1!.toFixed(1)} on ${cpus().length} cores.\n`,
  );
}

if (process.argv[1]?.endsWith("bench-checks.ts")) main();
