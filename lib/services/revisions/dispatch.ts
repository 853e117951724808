import "server-only";
import { spawn } from "node:child_process";
import path from "node:path";
import type { Db } from "../../../db/client";
import { failRevision } from "./generate";

/**
 * Renders a revision in its own process (`npx tsx scripts/generate-revision.ts
 * <id>`, same environment and working directory), detached so rendering a
 * packet with many datasheets never holds up the web server's requests.
 */
export function dispatchRevisionWorker(db: Db, revisionId: string): void {
  const root = process.cwd();
  const script = path.join(/*turbopackIgnore: true*/ root, "scripts", "generate-revision.ts");
  const child = spawn("npx", ["tsx", "--conditions=react-server", script, revisionId], { cwd: root, env: process.env, detached: true, stdio: "ignore" });
  child.once("error", (error) => failRevision(db, revisionId, `the generation process could not start (${error.message})`));
  child.once("exit", (code, signal) => {
    // The worker records its own failures; this catches a crash before it could.
    if (code !== 0) failRevision(db, revisionId, `the generation process stopped (${signal ?? `exit code ${code}`})`);
  });
  child.unref();
}
