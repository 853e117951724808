import "server-only";
import { notFound } from "next/navigation";
import { cache } from "react";
import type { ServiceContext } from "@/lib/services/context";
import { ServiceError } from "@/lib/services/errors";
import { getProjectRecord, type StoredProjectRecord } from "@/lib/services/projects/get-record";

export type LoadedProject = { ok: true; stored: StoredProjectRecord } | { ok: false; message: string; issues: { path: string; message: string }[] };

/** One read per request for the layout and the page; another organisation's id is a 404. */
export const loadProject = cache((ctx: ServiceContext, id: string): LoadedProject => {
  try {
    return { ok: true, stored: getProjectRecord(ctx, id) };
  } catch (error) {
    if (error instanceof ServiceError && error.code === "not-found") notFound();
    if (error instanceof ServiceError) return { ok: false, message: error.message, issues: error.issues };
    throw error;
  }
});
