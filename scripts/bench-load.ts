/**
 * npm run bench:load [-- --port 3171 --duration 10 --connections 20 --profile]
 *
 * Measures the web tier as a user meets it: a production server (`next start`,
 * from the last `npm run build`) on a database of 10,000 projects (the demo
 * seed with --scale, made once under data/bench/), driven by autocannon. Each
 * route is measured in the same run as a static JS chunk, the ceiling of what
 * the server can answer, and printed as a ratio to it.
 *
 * Aims: the signed-in projects list at least 0.4x static, health at least 0.8x,
 * p99 at most 100 ms at 20 connections, no errors. Then prints the first-load
 * JS of each page from the build (aim: at most 180 kB gzip) and the heaviest chunks.
 *
 * --profile writes a V8 CPU profile of the server to data/bench/profiles/ (open
 * it in Chrome DevTools, Performance tab).
 */
import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import { cpus, loadavg } from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import autocannon from "autocannon";
import Database from "better-sqlite3";
import { DEMO_USERS } from "../db/demo-scenario";
import { SCALE_BIG_PROJECT } from "../db/seed-scale";
import { ensureAuthSecret } from "./lib/ensure-secret";
import { printPageWeights } from "./lib/page-weight";
import { run } from "./lib/run";

const { values: args } = parseArgs({
  options: {
    port: { type: "string", default: "3171" },
    duration: { type: "string", default: "10" },
    connections: { type: "string", default: "20" },
    profile: { type: "boolean", default: false },
    only: { type: "string" },
  },
});
const PORT = Number(args.port);
const BASE = `http://127.0.0.1:${PORT}`;
const DIR = path.resolve("data/bench");
const DB_FILE = path.join(DIR, "scale.db");
const serverEnv: NodeJS.ProcessEnv = {
  ...process.env,
  NODE_ENV: "production",
  DATABASE_PATH: DB_FILE,
  UPLOADS_DIR: path.join(DIR, "uploads"),
  PACKETS_DIR: path.join(DIR, "packets"),
  MAIL_DIR: path.join(DIR, "mail"),
  APP_URL: BASE,
  // The bench signs in once; a lock-out must not be what it measures.
  SIGNIN_MAX_FAILURES: "1000",
};

async function prepareDatabase(): Promise<void> {
  if (fs.existsSync(DB_FILE)) return;
  console.log(`Seeding ${DB_FILE} (demo + 10,000 projects; once)…`);
  // The bench's own throwaway file, served as production: the seed is told this is a demo database.
  const code = await run("npx", ["tsx", "db/seed.ts", "--scale", "--force"], serverEnv);
  if (code !== 0) throw new Error("the scale seed failed");
}

async function startServer(): Promise<ChildProcess> {
  const profileDir = path.join(DIR, "profiles");
  const env = { ...serverEnv, ...(args.profile ? { NODE_OPTIONS: `--cpu-prof --cpu-prof-dir=${profileDir}` } : {}) };
  const child = spawn(process.execPath, [require.resolve("next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(PORT)], {
    env,
    stdio: ["ignore", "ignore", "inherit"],
  });
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}`);
    try {
      if ((await fetch(`${BASE}/api/health`)).ok) return child;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  child.kill("SIGTERM");
  throw new Error("next start did not answer /api/health within 60 s");
}

/** Signs in through the credentials form as a browser would; returns the session cookie. */
async function signIn(email: string, password: string): Promise<string> {
  const csrf = await fetch(`${BASE}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const csrfCookie = csrf.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const response = await fetch(`${BASE}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie },
    body: new URLSearchParams({ email, password, csrfToken, callbackUrl: `${BASE}/projects` }),
  });
  const session = response.headers.getSetCookie().find((c) => c.includes("session-token="));
  if (!session) throw new Error(`sign-in as ${email} did not give a session (status ${response.status})`);
  return session.split(";")[0]!;
}

function staticChunk(): string {
  const dir = path.resolve(".next/static/chunks");
  const file = fs
    .readdirSync(dir)
    .filter((f) => f.endsWith(".js"))
    .map((f) => ({ f, size: fs.statSync(path.join(dir, f)).size }))
    .sort((a, b) => a.size - b.size)
    .find((x) => x.size > 5_000);
  if (!file) throw new Error("no static chunk found: run `npm run build` first");
  return `/_next/static/chunks/${file.f}`;
}

interface Measured {
  name: string;
  reqPerSec: number;
  p50: number;
  p99: number;
  non2xx: number;
  errors: number;
}

async function measure(name: string, url: string, cookie?: string): Promise<Measured> {
  const headers = cookie ? { cookie } : undefined;
  const probe = await fetch(`${BASE}${url}`, { headers, redirect: "manual" });
  if (!probe.ok) throw new Error(`${name}: ${url} answered ${probe.status}`);
  // A short warm-up so compilation of the route's code is not counted.
  await autocannon({ url: `${BASE}${url}`, connections: 4, amount: 50, headers });
  const result = await autocannon({ url: `${BASE}${url}`, connections: Number(args.connections), duration: Number(args.duration), headers });
  return {
    name,
    reqPerSec: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors + result.timeouts,
  };
}

function ids(): { projectId: string; bigProjectId: string; projects: number } {
  const db = new Database(DB_FILE, { readonly: true });
  try {
    const big = db.prepare("select id from projects where name = ?").get(SCALE_BIG_PROJECT) as { id: string };
    const demo = db.prepare("select id from projects where name not like 'Scaled project %' and id <> ? order by created_at limit 1").get(big.id) as { id: string };
    const { n } = db.prepare("select count(*) as n from projects").get() as { n: number };
    return { projectId: demo.id, bigProjectId: big.id, projects: n };
  } finally {
    db.close();
  }
}

async function main(): Promise<void> {
  ensureAuthSecret();
  serverEnv.AUTH_SECRET = process.env.AUTH_SECRET;
  fs.mkdirSync(DIR, { recursive: true });
  if (!fs.existsSync(".next/BUILD_ID")) throw new Error("no production build: run `npm run build` first");
  await prepareDatabase();
  const { projectId, bigProjectId, projects } = ids();
  const server = await startServer();
  try {
    const designer = DEMO_USERS.find((u) => u.roles.includes("designer"))!;
    const office = DEMO_USERS.find((u) => u.roles.includes("office"))!;
    const designerCookie = await signIn(designer.email, designer.password);
    const officeCookie = await signIn(office.email, office.password);
    const targets: [string, string, string | undefined][] = [
      ["static chunk", staticChunk(), undefined],
      ["GET /api/health", "/api/health", undefined],
      ["projects list (page 1)", "/api/projects", designerCookie],
      ["one project's record", `/api/projects/${projectId}`, designerCookie],
      ["checks, 200 circuits", `/api/projects/${bigProjectId}/checks`, designerCookie],
      ["submissions queue (page 1)", "/api/submissions", officeCookie],
    ];
    const chosen = args.only ? targets.filter(([name]) => name === "static chunk" || name.includes(args.only!)) : targets;
    const results: Measured[] = [];
    for (const [name, url, cookie] of chosen) {
      process.stdout.write(`measuring ${name}…\n`);
      results.push(await measure(name, url, cookie));
    }
    const anchor = results[0]!.reqPerSec;
    console.log(
      `\nnext start on ${projects.toLocaleString("en-US")} projects; ${args.connections} connections, ${args.duration} s each; ` +
        `${cpus().length} cores, load ${loadavg()[0]!.toFixed(1)}\n`,
    );
    console.log(`${"route".padEnd(28)}${"req/s".padStart(8)}${"p50 ms".padStart(8)}${"p99 ms".padStart(8)}${"non-2xx".padStart(9)}${"errors".padStart(8)}${"× static".padStart(10)}`);
    for (const r of results) {
      console.log(
        `${r.name.padEnd(28)}${r.reqPerSec.toFixed(0).padStart(8)}${String(r.p50).padStart(8)}${String(r.p99).padStart(8)}${String(r.non2xx).padStart(9)}${String(r.errors).padStart(8)}${(r.reqPerSec / anchor).toFixed(2).padStart(10)}`,
      );
    }
    const list = results.find((r) => r.name.startsWith("projects list"));
    const health = results.find((r) => r.name.startsWith("GET /api/health"));
    console.log("\nAims: projects list ≥ 0.40× static, health ≥ 0.80× static, p99 ≤ 100 ms, 0 errors.");
    if (list) console.log(`  projects list ${(list.reqPerSec / anchor).toFixed(2)}× static, p99 ${list.p99} ms`);
    if (health) console.log(`  health ${(health.reqPerSec / anchor).toFixed(2)}× static, p99 ${health.p99} ms`);
    console.log(`  errors in all: ${results.reduce((n, r) => n + r.errors + r.non2xx, 0)}`);
    printPageWeights();
  } finally {
    server.kill("SIGTERM");
    await new Promise((r) => server.once("exit", r));
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
