"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { parseProjectFile } from "@/lib/compliance";
import type { JurisdictionOption } from "./new-project-form";
import { plural } from "@/lib/schemas/vocabulary";
import { describePath } from "./record-labels";

/** Project files are small JSON; anything far larger is not one. */
const MAX_FILE_BYTES = 5 * 1024 * 1024;

type State =
  | { kind: "idle" }
  | { kind: "refused"; message: string; issues: { path: string; message: string }[]; file?: unknown }
  | { kind: "choose-jurisdiction"; message: string }
  | { kind: "importing" };

export function ImportProjectForm({ jurisdictions }: { jurisdictions: JurisdictionOption[] }) {
  const router = useRouter();
  const [file, setFile] = useState<{ name: string; json: unknown } | null>(null);
  const [state, setState] = useState<State>({ kind: "idle" });
  const [jurisdictionId, setJurisdictionId] = useState("");

  const send = async (json: unknown, chosen?: string) => {
    setState({ kind: "importing" });
    const response = await fetch("/api/projects/import", {
      method: "POST",
      headers: { "content-type": "application/json", accept: "application/json" },
      body: JSON.stringify({ file: json, jurisdictionId: chosen || undefined }),
    });
    const body = (await response.json().catch(() => null)) as
      | { id?: string; error?: string; issues?: { path: string; message: string }[] }
      | null;
    if (response.ok && body?.id) {
      router.push(`/projects/${body.id}`);
      return;
    }
    const issues = body?.issues ?? [];
    if (issues.length === 1 && issues[0]?.path === "jurisdiction") {
      setState({ kind: "choose-jurisdiction", message: body?.error ?? "Choose a jurisdiction." });
      return;
    }
    setState({ kind: "refused", message: body?.error ?? `The server answered ${response.status}; nothing was imported.`, issues, file: json });
  };

  const onFile = async (f: File | undefined) => {
    setFile(null);
    setState({ kind: "idle" });
    if (!f) return;
    if (f.size > MAX_FILE_BYTES) {
      setState({ kind: "refused", message: `${f.name} is larger than a project file can be; nothing was imported.`, issues: [] });
      return;
    }
    let json: unknown;
    try {
      json = JSON.parse(await f.text());
    } catch {
      setState({ kind: "refused", message: `${f.name} is not a JSON file; nothing was imported.`, issues: [] });
      return;
    }
    // The same validation the server runs, so every refusal is listed before anything is sent.
    const parsed = parseProjectFile(json);
    if (!parsed.ok) {
      setState({ kind: "refused", message: `${f.name} was not imported: ${plural(parsed.issues.length, "field")} ${parsed.issues.length === 1 ? "is" : "are"} not valid. Nothing was created.`, issues: parsed.issues, file: json });
      return;
    }
    setFile({ name: f.name, json });
  };

  return (
    <div className="sheet max-w-3xl space-y-4 px-5 py-5">
      <p className="text-sm text-ink-soft">
        A project file holds the whole design record (site, equipment, arrays, circuits, loads). Importing creates a new project; the
        file is checked field by field first and nothing is created unless all of it is valid. Attachment entries in the file are
        listed but their documents are not in it — upload them again on the Attachments tab.
      </p>
      <div>
        <label htmlFor="project-file" className="field-label mb-1 block">
          Project file (.json)
        </label>
        <input id="project-file" type="file" accept="application/json,.json" className="input" onChange={(e) => void onFile(e.target.files?.[0])} />
      </div>
      {file ? (
        <div className="flex flex-wrap items-center gap-3">
          <p className="text-sm">
            <span className="font-medium">{file.name}</span> is a valid project file.
          </p>
          <button type="button" className="btn" disabled={state.kind === "importing"} onClick={() => void send(file.json)}>
            {state.kind === "importing" ? "Importing…" : "Import as new project"}
          </button>
        </div>
      ) : null}
      {state.kind === "choose-jurisdiction" && file ? (
        <div role="alert" className="border-l-4 border-l-query bg-query-soft/50 px-3 py-3 text-sm">
          <p>{state.message}</p>
          <div className="mt-2 flex flex-wrap items-end gap-2">
            <div>
              <label htmlFor="import-jurisdiction" className="field-label mb-1 block">
                Jurisdiction
              </label>
              <select id="import-jurisdiction" className="input w-72" value={jurisdictionId} onChange={(e) => setJurisdictionId(e.target.value)}>
                <option value="">— choose —</option>
                {jurisdictions.map((j) => (
                  <option key={j.id} value={j.id}>
                    {j.name} (NEC {j.necEdition})
                  </option>
                ))}
              </select>
            </div>
            <button type="button" className="btn" disabled={!jurisdictionId} onClick={() => void send(file.json, jurisdictionId)}>
              Import into this jurisdiction
            </button>
          </div>
        </div>
      ) : null}
      {state.kind === "refused" ? (
        <div role="alert" className="border-l-4 border-l-signal bg-signal-soft/40 px-3 py-3 text-sm">
          <p className="font-semibold">{state.message}</p>
          {state.issues.length ? (
            <table className="data-table mt-2" aria-label="Refused fields">
              <thead>
                <tr>
                  <th>Field</th>
                  <th>Problem</th>
                </tr>
              </thead>
              <tbody>
                {state.issues.map((i, n) => (
                  <tr key={`${i.path}-${n}`}>
                    <td className="text-xs">{describePath(state.file, i.path)}</td>
                    <td>{i.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
