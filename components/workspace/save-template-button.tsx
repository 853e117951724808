"use client";

/**
 * Saves the saved design of this project as one of the organisation's
 * templates (new, or in place of an existing one), so the next project of
 * the same kind starts from it. The site stays with the project.
 */
import { useState } from "react";
import { fetchJson } from "@/lib/fetch-json";
import type { TemplateSummary } from "@/lib/services/templates/list";

export function SaveTemplateButton({ projectId, projectName, disabledReason }: { projectId: string; projectName: string; disabledReason?: string }) {
  const [open, setOpen] = useState(false);
  const [templates, setTemplates] = useState<TemplateSummary[]>([]);
  const [name, setName] = useState("");
  const [replace, setReplace] = useState("");
  const [state, setState] = useState<{ busy: boolean; error?: string; done?: string }>({ busy: false });

  const show = async () => {
    setOpen(true);
    setName(projectName);
    setReplace("");
    setState({ busy: false });
    try {
      setTemplates((await fetchJson<{ templates: TemplateSummary[] }>("/api/templates")).templates);
    } catch {
      setTemplates([]);
    }
  };
  const save = async () => {
    if (!replace && !name.trim()) {
      setState({ busy: false, error: "Name the template." });
      return;
    }
    setState({ busy: true });
    try {
      const replaced = templates.find((t) => t.id === replace);
      await fetchJson("/api/templates", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(replaced ? { projectId, replaceTemplateId: replaced.id, expectedVersion: replaced.version } : { projectId, name }),
      });
      setState({ busy: false, done: replaced ? `Template "${replaced.name}" now holds this design.` : `Saved as template "${name.trim()}".` });
    } catch (error) {
      setState({ busy: false, error: error instanceof Error ? error.message : "The template was not saved." });
    }
  };

  return (
    <span className="relative">
      <button type="button" className="btn-quiet" disabled={Boolean(disabledReason)} title={disabledReason ?? "Keep this design to start other projects from"} onClick={() => (open ? setOpen(false) : void show())}>
        Save as template
      </button>
      {open ? (
        <div role="group" aria-label="Save as template" className="sheet absolute right-0 top-full z-30 mt-1 w-80 space-y-2 px-3 py-3 text-sm shadow-md">
          <p className="text-xs text-ink-soft">The equipment, arrays, circuits and loads are kept; the site, the client and the documents are not.</p>
          <label className="block">
            <span className="field-label mb-1 block">Save as</span>
            <select className="input" value={replace} onChange={(e) => setReplace(e.target.value)}>
              <option value="">a new template</option>
              {templates.map((t) => (
                <option key={t.id} value={t.id}>
                  in place of {t.name}
                </option>
              ))}
            </select>
          </label>
          {replace ? null : (
            <label className="block">
              <span className="field-label mb-1 block">Template name</span>
              <input className="input" value={name} maxLength={120} onChange={(e) => setName(e.target.value)} />
            </label>
          )}
          {state.error ? (
            <p role="alert" className="text-xs font-medium text-signal">
              {state.error}
            </p>
          ) : null}
          {state.done ? (
            <p role="status" className="text-xs text-ink">
              {state.done}
            </p>
          ) : null}
          <div className="flex gap-2">
            <button type="button" className="btn" disabled={state.busy} onClick={() => void save()}>
              {state.busy ? "Saving…" : "Save template"}
            </button>
            <button type="button" className="btn-quiet" onClick={() => setOpen(false)}>
              Close
            </button>
          </div>
        </div>
      ) : null}
    </span>
  );
}
