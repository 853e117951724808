import "server-only";
import { runChecks, type CheckRun } from "../../compliance";
import type { NecEdition } from "../../schemas/project-record";
import type { ServiceContext } from "../context";
import { getProjectRecord } from "./get-record";

/** The check run of a stored project, in the jurisdiction's edition unless one is named. */
export function checkProject(ctx: ServiceContext, projectId: string, edition?: NecEdition): CheckRun {
  const { record } = getProjectRecord(ctx, projectId);
  return runChecks(record, edition ? { edition } : {});
}
