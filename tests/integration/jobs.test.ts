import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { bullmqJobQueue, runBullmqWorker } from "../../lib/jobs/bullmq";
import { runSqliteWorker, sqliteJobQueue } from "../../lib/jobs/sqlite";
import type { JobHandlers, JobInfo, JobQueue, RunningWorker, WorkerOptions } from "../../lib/jobs/types";
import { tempDatabase } from "./factories";

/**
 * The job interface behaves the same on both backends: the jobs table in the
 * database file and BullMQ over a real redis-server started here on loopback.
 */

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

async function startRedis(): Promise<{ url: string; stop: () => Promise<void> }> {
  if (spawnSync("sh", ["-c", "command -v redis-server"]).status !== 0) {
    throw new Error("redis-server is not installed (apt-get install redis-server; `npm test` installs it)");
  }
  const port = await freePort();
  const child = spawn("redis-server", ["--port", String(port), "--bind", "127.0.0.1", "--save", "", "--appendonly", "no"], { stdio: ["ignore", "pipe", "pipe"] });
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error("redis-server did not start in 10 s")), 10_000);
    child.stdout!.on("data", (chunk: Buffer) => {
      if (chunk.toString().includes("Ready to accept connections")) {
        clearTimeout(timer);
        resolve();
      }
    });
    child.once("exit", (code) => reject(new Error(`redis-server exited with ${code}`)));
  });
  return {
    url: `redis://127.0.0.1:${port}`,
    stop: () =>
      new Promise((resolve) => {
        child.once("exit", () => resolve());
        child.kill("SIGTERM");
      }),
  };
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function until<T>(read: () => T | undefined | false, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = read();
    if (value) return value;
    if (Date.now() > deadline) throw new Error("timed out waiting");
    await sleep(25);
  }
}

interface Backend {
  name: "sqlite" | "bullmq";
  queue: () => JobQueue;
  worker: (options: WorkerOptions) => RunningWorker;
  childEnv: () => Record<string, string>;
}

const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-jobs-"));
const database = tempDatabase();
let redis: { url: string; stop: () => Promise<void> } | undefined;
let queueCounter = 0;
let queueName = "";

const backends: Backend[] = [
  {
    name: "sqlite",
    queue: () => sqliteJobQueue(database.db),
    worker: (options) => runSqliteWorker(database.db, { pollMs: 20, ...options }),
    childEnv: () => ({ JOB_TEST_BACKEND: "sqlite", JOB_TEST_DB: database.file }),
  },
  {
    name: "bullmq",
    queue: () => bullmqJobQueue(redis!.url, { backoffMs: 100, queueName }),
    worker: (options) => runBullmqWorker(redis!.url, { ...options, queueName }),
    childEnv: () => ({ JOB_TEST_BACKEND: "bullmq", JOB_TEST_REDIS: redis!.url, JOB_TEST_QUEUE: queueName }),
  },
];

beforeAll(async () => {
  redis = await startRedis();
}, 20_000);
afterAll(async () => {
  await redis?.stop();
  database.cleanup();
  fs.rmSync(scratch, { recursive: true, force: true });
});

type Run = { kind: string; payload: unknown; attempt: number; at: number };

function handlersThat(run: (kind: string, payload: unknown, info: JobInfo) => Promise<void>): JobHandlers {
  return {
    "packet.generate": (payload, info) => run("packet.generate", payload, info),
    "packet.restamp": (payload, info) => run("packet.restamp", payload, info),
    "mail.deliver": (payload, info) => run("mail.deliver", payload, info),
  };
}

const base = { concurrency: 2, timeLimitMs: 5_000, leaseMs: 1_000, backoffMs: 100 };

describe.each(backends)("jobs on $name", (backend) => {
  let queue: JobQueue;
  const workers: RunningWorker[] = [];
  const children: ChildProcess[] = [];

  beforeAll(() => {
    queueName = `sundocket-test-${process.pid}-${++queueCounter}`;
    queue = backend.queue();
  });
  afterAll(async () => {
    for (const child of children) child.kill("SIGKILL");
    await Promise.all(workers.map((w) => w.stop()));
    await queue.close();
  });

  function start(options: Partial<WorkerOptions> & Pick<WorkerOptions, "handlers">): RunningWorker {
    const worker = backend.worker({ ...base, ...options });
    workers.push(worker);
    return worker;
  }

  it("runs an enqueued job once with its payload", async () => {
    const runs: Run[] = [];
    const worker = start({ handlers: handlersThat(async (kind, payload, info) => void runs.push({ kind, payload, attempt: info.attempt, at: Date.now() })) });
    await queue.enqueue("mail.deliver", { orgId: "org-1" });
    await until(() => runs.length === 1);
    await sleep(200);
    await worker.stop();
    expect(runs).toEqual([expect.objectContaining({ kind: "mail.deliver", payload: { orgId: "org-1" }, attempt: 1 })]);
  });

  it("retries a failing job with a growing wait, then succeeds", async () => {
    const runs: Run[] = [];
    const worker = start({
      handlers: handlersThat(async (kind, payload, info) => {
        runs.push({ kind, payload, attempt: info.attempt, at: Date.now() });
        if (info.attempt < 3) throw new Error(`attempt ${info.attempt} fails`);
      }),
    });
    await queue.enqueue("packet.generate", { revisionId: "rev-retry" }, { maxAttempts: 3 });
    await until(() => runs.length === 3);
    await worker.stop();
    expect(runs.map((r) => r.attempt)).toEqual([1, 2, 3]);
    // Backoff of 100 ms doubling: at least 100 ms before the second run and 200 ms before the third.
    expect(runs[1]!.at - runs[0]!.at).toBeGreaterThanOrEqual(90);
    expect(runs[2]!.at - runs[1]!.at).toBeGreaterThanOrEqual(180);
  });

  it("gives up after the last attempt and reports the failure once", async () => {
    const finals: { kind: string; payload: unknown; reason: string }[] = [];
    let runs = 0;
    const worker = start({
      handlers: handlersThat(async () => {
        runs += 1;
        throw new Error("the datasheet store is unreachable");
      }),
      onFinalFailure: (kind, payload, reason) => void finals.push({ kind, payload, reason }),
    });
    await queue.enqueue("packet.restamp", { revisionId: "rev-doomed" }, { maxAttempts: 2 });
    await until(() => finals.length === 1);
    await sleep(400);
    await worker.stop();
    expect(runs).toBe(2);
    expect(finals).toEqual([{ kind: "packet.restamp", payload: { revisionId: "rev-doomed" }, reason: expect.stringContaining("unreachable") }]);
  });

  it("fails an attempt that runs past its time limit", async () => {
    const finals: string[] = [];
    const worker = start({
      timeLimitMs: 150,
      handlers: handlersThat(async (_kind, _payload, info) => {
        await new Promise((resolve) => setTimeout(resolve, 2_000).unref());
        void info;
      }),
      onFinalFailure: (_kind, _payload, reason) => void finals.push(reason),
    });
    await queue.enqueue("packet.generate", { revisionId: "rev-slow" }, { maxAttempts: 1 });
    await until(() => finals.length === 1);
    await worker.stop();
    expect(finals[0]).toMatch(/longer than its limit/);
  });

  it("runs no more jobs at once than its concurrency", async () => {
    let running = 0;
    let peak = 0;
    let done = 0;
    const worker = start({
      concurrency: 2,
      handlers: handlersThat(async () => {
        running += 1;
        peak = Math.max(peak, running);
        await sleep(150);
        running -= 1;
        done += 1;
      }),
    });
    for (let i = 0; i < 6; i++) await queue.enqueue("mail.deliver", { orgId: `org-${i}` });
    await until(() => done === 6);
    await worker.stop();
    expect(peak).toBe(2);
  });

  it("a job whose worker is killed mid-run is claimed again by another worker and finishes", async () => {
    const markers = fs.mkdtempSync(path.join(scratch, `${backend.name}-markers-`));
    // tsx as a loader in this very process (not its CLI, which runs a second one), so the kill lands on the worker.
    const child = spawn(process.execPath, ["--import", "tsx", path.resolve("tests/fixtures/slow-job-worker.ts")], {
      env: { ...process.env, ...backend.childEnv(), JOB_TEST_MARKERS: markers, JOB_TEST_LEASE_MS: "1000" },
      stdio: ["ignore", "inherit", "inherit"],
    });
    children.push(child);
    await queue.enqueue("packet.generate", { revisionId: "rev-orphaned" });
    const startedFile = await until(() => fs.readdirSync(markers).find((f) => f.startsWith("started-")), 30_000);
    expect(startedFile).toBe(`started-${child.pid}`);
    child.kill("SIGKILL");
    await new Promise((resolve) => child.once("exit", resolve));

    const runs: Run[] = [];
    const worker = start({ handlers: handlersThat(async (kind, payload, info) => void runs.push({ kind, payload, attempt: info.attempt, at: Date.now() })) });
    await until(() => runs.length === 1, 20_000);
    await worker.stop();
    expect(runs[0]).toMatchObject({ kind: "packet.generate", payload: { revisionId: "rev-orphaned" } });
  }, 60_000);
});
