"use client";

import { useState } from "react";
import { fetchJson } from "@/lib/fetch-json";
import { SYSTEM_KIND_LABELS } from "@/lib/schemas/project-record";
import type { TemplateSummary } from "@/lib/services/templates/list";

const kindLabel = (kind: string) => SYSTEM_KIND_LABELS[kind as keyof typeof SYSTEM_KIND_LABELS] ?? kind;

export function TemplatesTable({ initial, canEdit }: { initial: TemplateSummary[]; canEdit: boolean }) {
  const [rows, setRows] = useState(initial);
  const [editing, setEditing] = useState<{ id: string; name: string; description: string } | null>(null);
  const [asking, setAsking] = useState<string | null>(null);
  const [message, setMessage] = useState<{ error?: string; done?: string }>({});

  const rename = async () => {
    if (!editing) return;
    const row = rows.find((r) => r.id === editing.id)!;
    try {
      const { version } = await fetchJson<{ version: number }>(`/api/templates/${row.id}`, {
        method: "PATCH",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ name: editing.name, description: editing.description, version: row.version }),
      });
      setRows((all) => all.map((r) => (r.id === row.id ? { ...r, name: editing.name.trim(), description: editing.description.trim(), version } : r)));
      setEditing(null);
      setMessage({ done: `Renamed to "${editing.name.trim()}".` });
    } catch (error) {
      setMessage({ error: error instanceof Error ? error.message : "The template was not renamed." });
    }
  };
  const remove = async (id: string) => {
    try {
      await fetchJson(`/api/templates/${id}`, { method: "DELETE" });
      const gone = rows.find((r) => r.id === id);
      setRows((all) => all.filter((r) => r.id !== id));
      setAsking(null);
      setMessage({ done: `Deleted "${gone?.name}". Projects made from it keep their design.` });
    } catch (error) {
      setMessage({ error: error instanceof Error ? error.message : "The template was not deleted." });
    }
  };

  if (rows.length === 0) {
    return <p className="sheet px-4 py-8 text-center text-sm text-ink-soft">No templates yet. Open a project and use Save as template.</p>;
  }
  return (
    <div className="sheet overflow-x-auto">
      {message.error ? (
        <p role="alert" className="border-l-4 border-l-signal px-4 py-2 text-sm">
          {message.error}
        </p>
      ) : message.done ? (
        <p role="status" className="px-4 py-2 text-sm">
          {message.done}
        </p>
      ) : null}
      <table className="data-table" aria-label="Project templates">
        <thead>
          <tr>
            <th>Template</th>
            <th>System</th>
            <th className="text-right">Equipment</th>
            <th className="text-right">Circuits</th>
            <th>Updated</th>
            {canEdit ? <th className="sr-only">Actions</th> : null}
          </tr>
        </thead>
        <tbody>
          {rows.map((t) => (
            <tr key={t.id}>
              <td className="max-w-xl">
                {editing?.id === t.id ? (
                  <div className="space-y-1">
                    <input aria-label={`Name of ${t.name}`} className="input" value={editing.name} maxLength={120} onChange={(e) => setEditing({ ...editing, name: e.target.value })} />
                    <input
                      aria-label={`Description of ${t.name}`}
                      className="input"
                      value={editing.description}
                      maxLength={300}
                      onChange={(e) => setEditing({ ...editing, description: e.target.value })}
                    />
                  </div>
                ) : (
                  <>
                    <span className="font-medium">{t.name}</span>
                    <span className="block text-xs text-ink-soft">{t.description}</span>
                  </>
                )}
              </td>
              <td>{kindLabel(t.systemKind)}</td>
              <td className="figure text-right">{t.equipmentCount}</td>
              <td className="figure text-right">{t.circuitCount}</td>
              <td className="figure whitespace-nowrap text-xs text-ink-soft">{t.updatedAt.slice(0, 10)}</td>
              {canEdit ? (
                <td className="whitespace-nowrap text-right">
                  {editing?.id === t.id ? (
                    <>
                      <button type="button" className="btn" onClick={() => void rename()}>
                        Save name
                      </button>{" "}
                      <button type="button" className="btn-quiet" onClick={() => setEditing(null)}>
                        Cancel
                      </button>
                    </>
                  ) : asking === t.id ? (
                    <span role="alertdialog" aria-label={`Delete ${t.name}?`} className="inline-flex items-center gap-2 text-sm">
                      Delete this template?
                      <button type="button" className="btn" onClick={() => void remove(t.id)}>
                        Delete
                      </button>
                      <button type="button" className="btn-quiet" onClick={() => setAsking(null)}>
                        Keep
                      </button>
                    </span>
                  ) : (
                    <>
                      <button type="button" className="btn-quiet" onClick={() => setEditing({ id: t.id, name: t.name, description: t.description })}>
                        Rename
                      </button>{" "}
                      <button type="button" className="btn-quiet" aria-label={`Delete ${t.name}`} onClick={() => setAsking(t.id)}>
                        Delete
                      </button>
                    </>
                  )}
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
