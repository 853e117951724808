import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { env } from "../env";

const globalForWorker = globalThis as unknown as { sundocketWorker?: { child: ChildProcess | null; closing: boolean } };

/**
 * On one machine the web server starts the job worker beside itself, so
 * `npm start` alone renders packets. The worker is a separate process: a
 * packet's CPU-heavy rendering never holds up a request. It is the compiled
 * dist/worker.cjs when built, or scripts/worker.ts through tsx in development.
 * If it stops it is started again; it leaves when the server does.
 */
export function startWorkerBeside(): void {
  if (env().JOBS_WORKER !== "spawn" || globalForWorker.sundocketWorker) return;
  const state: { child: ChildProcess | null; closing: boolean } = { child: null, closing: false };
  globalForWorker.sundocketWorker = state;
  const root = process.cwd();
  const compiled = path.join(/*turbopackIgnore: true*/ root, "dist", "worker.cjs");
  const args = fs.existsSync(compiled)
    ? [compiled]
    : [path.join(/*turbopackIgnore: true*/ root, "node_modules", "tsx", "dist", "cli.mjs"), path.join(/*turbopackIgnore: true*/ root, "scripts", "worker.ts")];

  const launch = () => {
    const child = spawn(process.execPath, args, { cwd: root, env: process.env, stdio: ["ignore", "inherit", "inherit", "ipc"] });
    state.child = child;
    child.once("exit", (code, signal) => {
      state.child = null;
      if (state.closing) return;
      console.error(`the job worker stopped (${signal ?? `exit code ${code}`}); starting it again`);
      setTimeout(launch, 1_000).unref();
    });
    child.once("error", (error) => console.error(`the job worker could not start: ${error.message}`));
  };
  launch();
  const close = () => {
    state.closing = true;
    state.child?.kill("SIGTERM");
  };
  // A server killed outright closes the worker's IPC channel instead, and the worker leaves on that.
  process.once("exit", close);
}
