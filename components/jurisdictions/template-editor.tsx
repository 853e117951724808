"use client";

import { useEffect, useRef, useState, useTransition } from "react";
import { previewSheetTemplateAction, saveSheetTemplateAction } from "@/app/(app)/jurisdictions/[id]/actions";
import type { SheetTemplateView } from "@/lib/services/jurisdictions/templates";

const TEMPLATE_LABELS: Record<string, string> = {
  cover: "Cover",
  "general-notes": "General notes",
  "site-plan": "Site plan",
  "one-line": "One-line diagram",
  "energy-storage": "Energy storage",
  calculations: "Calculations",
  schedules: "Schedules",
  "label-schedule": "Label schedule",
  grounding: "Grounding and bonding",
  "review-record": "Review record",
};

type Refusal = { line: number | null; message: string; name?: string };

/** "Line 3: unknown variable …" → 3, for the refusals that come back from a save. */
function lineOf(text: string): number | null {
  const m = /^line (\d+)/i.exec(text);
  return m ? Number(m[1]) : null;
}

function selectLine(area: HTMLTextAreaElement, line: number) {
  const lines = area.value.split("\n");
  const start = lines.slice(0, line - 1).reduce((n, l) => n + l.length + 1, 0);
  const end = start + (lines[line - 1]?.length ?? 0);
  area.focus();
  area.setSelectionRange(start, end);
}

function toBlobUrl(base64: string): string {
  const bin = atob(base64);
  const bytes = new Uint8Array(bin.length);
  for (let i = 0; i < bin.length; i += 1) bytes[i] = bin.charCodeAt(i);
  return URL.createObjectURL(new Blob([bytes], { type: "application/pdf" }));
}

export function TemplateEditor({
  jurisdictionId,
  version: initialVersion,
  canEdit,
  templates,
}: {
  jurisdictionId: string;
  version: number;
  canEdit: boolean;
  templates: SheetTemplateView[];
}) {
  const [selected, setSelected] = useState<string>(templates[0]?.name ?? "cover");
  const [drafts, setDrafts] = useState<Record<string, string>>(() => Object.fromEntries(templates.map((t) => [t.name, t.source])));
  const [overridden, setOverridden] = useState<Record<string, boolean>>(() => Object.fromEntries(templates.map((t) => [t.name, t.overridden])));
  const [version, setVersion] = useState(initialVersion);
  const [refusal, setRefusal] = useState<Refusal | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [preview, setPreview] = useState<{ url: string; sheet: string; projectName: string } | null>(null);
  const [pending, startTransition] = useTransition();
  const area = useRef<HTMLTextAreaElement>(null);
  const current = templates.find((t) => t.name === selected)!;
  const label = TEMPLATE_LABELS[selected] ?? selected;
  const source = drafts[selected] ?? "";

  useEffect(() => () => (preview ? URL.revokeObjectURL(preview.url) : undefined), [preview]);
  useEffect(() => {
    if (refusal?.line && area.current) selectLine(area.current, refusal.line);
  }, [refusal]);

  function choose(name: string) {
    setSelected(name);
    setRefusal(null);
    setNotice(null);
    setPreview(null);
  }

  function save(text: string) {
    setNotice(null);
    setRefusal(null);
    startTransition(async () => {
      const result = await saveSheetTemplateAction({ jurisdictionId, name: selected, source: text, version });
      if (!result.ok) {
        setRefusal({ line: lineOf(result.error), message: result.error, name: result.issues.find((i) => i.path === "variable")?.message });
        return;
      }
      setVersion(result.data!.version);
      setOverridden((o) => ({ ...o, [selected]: result.data!.overridden }));
      if (!result.data!.overridden) setDrafts((d) => ({ ...d, [selected]: current.shippedSource }));
      setNotice(result.message ?? "Saved.");
    });
  }

  function runPreview() {
    setNotice(null);
    setRefusal(null);
    startTransition(async () => {
      const result = await previewSheetTemplateAction({ jurisdictionId, name: selected, source });
      if (!result.ok) {
        setRefusal({ line: null, message: result.error });
        return;
      }
      const p = result.data!;
      if (!p.ok) {
        setRefusal({ line: p.line, message: `Line ${p.line}: ${p.message}.`, name: p.name });
        return;
      }
      setPreview({ url: toBlobUrl(p.pdfBase64), sheet: p.sheet, projectName: p.projectName });
    });
  }

  return (
    <section aria-label="Sheet templates" className="sheet">
      <h2 className="border-b border-rule px-4 py-2 text-sm font-semibold">Sheet templates</h2>
      <div role="tablist" aria-label="Sheet template" className="flex flex-wrap gap-1 border-b border-grid px-3 py-2">
        {templates.map((t) => (
          <button
            key={t.name}
            type="button"
            role="tab"
            id={`tab-${t.name}`}
            aria-selected={t.name === selected}
            aria-controls="template-panel"
            onClick={() => choose(t.name)}
            className={`rounded-[2px] border px-2 py-1 text-xs ${t.name === selected ? "border-slate bg-slate text-white" : "border-rule bg-sheet text-ink hover:border-slate"}`}
          >
            {TEMPLATE_LABELS[t.name] ?? t.name}
            {overridden[t.name] ? <span className="ml-1 font-semibold">· local</span> : null}
          </button>
        ))}
      </div>
      <div role="tabpanel" id="template-panel" aria-labelledby={`tab-${selected}`} className="grid gap-3 px-4 py-3">
        <p className="text-xs text-ink-soft">
          {current.sheets.map((s) => `${s.code} ${s.title}`).join("; ")} —{" "}
          {overridden[selected] ? "this jurisdiction's own template." : "the shipped template (no override)."} Handlebars; the variables are those of
          the packet's template context, and an unknown one is refused.
        </p>
        <div>
          <label htmlFor="template-source" className="field-label">
            Template source: {label}
          </label>
          <textarea
            id="template-source"
            ref={area}
            className="input figure mt-1 min-h-[22rem] text-xs leading-5"
            spellCheck={false}
            readOnly={!canEdit}
            value={source}
            aria-invalid={refusal?.line ? true : undefined}
            aria-describedby={refusal ? "template-refusal" : undefined}
            onChange={(e) => {
              const value = e.target.value;
              setDrafts((d) => ({ ...d, [selected]: value }));
            }}
          />
        </div>
        {refusal ? (
          <div id="template-refusal" role="alert" className="border-l-4 border-l-signal bg-signal-soft px-3 py-2 text-sm">
            <p className="font-semibold">{refusal.line ? `Refused at line ${refusal.line}` : "Refused"}</p>
            <p className="mt-0.5">{refusal.message}</p>
            {refusal.name ? (
              <p className="mt-0.5 text-xs">
                Name: <code className="figure">{refusal.name}</code>
              </p>
            ) : null}
          </div>
        ) : null}
        {notice ? (
          <p role="status" className="text-sm">
            <span aria-hidden="true">● </span>
            {notice}
          </p>
        ) : null}
        {canEdit ? (
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-quiet" disabled={pending} onClick={runPreview}>
              Preview sheet
            </button>
            <button type="button" className="btn" disabled={pending} onClick={() => save(source)}>
              Save template
            </button>
            {overridden[selected] ? (
              <button type="button" className="btn-quiet" disabled={pending} onClick={() => save("")}>
                Use the shipped template
              </button>
            ) : null}
            {pending ? (
              <span role="status" className="self-center text-xs text-ink-soft">
                Working…
              </span>
            ) : null}
          </div>
        ) : (
          <p className="text-xs text-ink-soft">The permit office edits these templates.</p>
        )}
        {preview ? (
          <figure className="border border-rule">
            <figcaption className="border-b border-rule px-3 py-1 text-xs text-ink-soft">
              Preview of {preview.sheet}, first page, drawn with {preview.projectName} — not saved until you save the template.
            </figcaption>
            <iframe title={`Preview of ${preview.sheet}`} src={`${preview.url}#toolbar=0&navpanes=0&view=FitH`} className="h-[32rem] w-full bg-white" />
          </figure>
        ) : null}
      </div>
    </section>
  );
}
