/** Runs once as the server starts: on one machine, the job worker starts beside it. */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs" || process.env.NEXT_PHASE === "phase-production-build") return;
  const { startWorkerBeside } = await import("./lib/jobs/spawn");
  startWorkerBeside();
}
