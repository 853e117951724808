"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { fetchJson } from "@/lib/fetch-json";

/** Archive and bring back a project; an archived one says so above its tabs. */
export function ArchiveControl({ projectId, archivedAt, canEdit }: { projectId: string; archivedAt: string | null; canEdit: boolean }) {
  const router = useRouter();
  const [state, setState] = useState<{ busy: boolean; error?: string }>({ busy: false });
  const act = async (method: "POST" | "DELETE") => {
    setState({ busy: true });
    try {
      await fetchJson(`/api/projects/${projectId}/archive`, { method });
      setState({ busy: false });
      router.refresh();
    } catch (error) {
      setState({ busy: false, error: error instanceof Error ? error.message : "Nothing was changed." });
    }
  };
  const error = state.error ? (
    <span role="alert" className="text-xs font-medium text-signal">
      {state.error}
    </span>
  ) : null;
  if (archivedAt) {
    return (
      <div role="status" className="sheet mb-3 flex flex-wrap items-center gap-3 border-l-4 border-l-caution px-4 py-2 text-sm">
        <span>Archived on {archivedAt.slice(0, 10)}: it is not on the projects list. Its design, revisions and documents are kept.</span>
        {canEdit ? (
          <button type="button" className="btn-quiet" disabled={state.busy} onClick={() => void act("DELETE")}>
            Bring back from the archive
          </button>
        ) : null}
        {error}
      </div>
    );
  }
  if (!canEdit) return null;
  return (
    <div className="mb-2 flex flex-wrap items-center justify-end gap-2">
      {error}
      <button type="button" className="btn-quiet text-xs" disabled={state.busy} title="Take it off the projects list; it can be brought back" onClick={() => void act("POST")}>
        Archive project
      </button>
    </div>
  );
}
