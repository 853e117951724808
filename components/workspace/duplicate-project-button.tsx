"use client";

/**
 * Starts a new project from this one: the saved design is exported and
 * imported again under a new name, so the copy goes through the same
 * validation as any project file. Attachments stay with the original.
 */
import { useRouter } from "next/navigation";
import { useState } from "react";

export function DuplicateProjectButton({ projectId, disabledReason }: { projectId: string; disabledReason?: string }) {
  const router = useRouter();
  const [state, setState] = useState<{ busy: boolean; error?: string }>({ busy: false });
  const duplicate = async () => {
    setState({ busy: true });
    try {
      const exported = await fetch(`/api/projects/${projectId}/export`, { headers: { accept: "application/json" } });
      if (!exported.ok) throw new Error(`The project could not be read (${exported.status}).`);
      const file = (await exported.json()) as { name: string };
      const response = await fetch("/api/projects/import", {
        method: "POST",
        headers: { "content-type": "application/json", accept: "application/json" },
        body: JSON.stringify({ file: { ...file, name: `${file.name} (copy)`.slice(0, 200), attachments: [] } }),
      });
      const body = (await response.json().catch(() => null)) as { id?: string; error?: string } | null;
      if (!response.ok || !body?.id) throw new Error(body?.error ?? `The copy was not created (${response.status}).`);
      router.push(`/projects/${body.id}`);
    } catch (error) {
      setState({ busy: false, error: error instanceof Error ? error.message : "The copy was not created." });
    }
  };
  return (
    <>
      <button type="button" className="btn-quiet" disabled={state.busy || Boolean(disabledReason)} title={disabledReason ?? "A new project with this saved design"} onClick={() => void duplicate()}>
        {state.busy ? "Duplicating…" : "Duplicate"}
      </button>
      {state.error ? (
        <span role="alert" className="text-xs text-signal">
          {state.error}
        </span>
      ) : null}
    </>
  );
}
