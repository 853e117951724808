"use client";

/**
 * The designer's editor for one project: the whole record in one form,
 * validated with the project record schema at every field, checked live in
 * the browser, saved in one request that carries the version it was opened
 * at — a stale save is refused and nothing is overwritten.
 */
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { FormProvider, useForm } from "react-hook-form";
import { projectRecordSchema, type ProjectRecord, type ProjectRecordInput } from "@/lib/schemas/project-record";
import { ChecksPanel } from "./checks-panel";
import { DiagramSection } from "./diagram-section";
import { DuplicateProjectButton } from "./duplicate-project-button";
import { EquipmentSection } from "./equipment-section";
import { LiveChecksProvider } from "./live-checks";
import { LoadsSection } from "./loads-section";
import { ArraysSection, CircuitsSection } from "./row-sections";
import { GroundingSection, ProjectSection, SiteSection } from "./site-section";
import { useUnsavedGuard } from "./unsaved-guard";
import { useRecordHistory } from "./use-record-history";
import { SaveTemplateButton } from "./save-template-button";

const SECTIONS = [
  ["project", "Project"],
  ["site", "Site"],
  ["equipment", "Equipment"],
  ["arrays", "Arrays"],
  ["circuits", "Circuits"],
  ["loads", "Loads"],
  ["diagram", "Diagram"],
] as const;

type SaveState =
  | { kind: "idle" }
  | { kind: "saving" }
  | { kind: "saved"; version: number }
  | { kind: "invalid"; message: string }
  | { kind: "error"; message: string }
  | { kind: "conflict"; message: string };

export function ProjectEditor({
  projectId,
  version: openedVersion,
  record,
  canEdit,
}: {
  projectId: string;
  version: number;
  record: ProjectRecord;
  canEdit: boolean;
}) {
  const router = useRouter();
  const form = useForm<ProjectRecordInput, unknown, ProjectRecord>({
    defaultValues: record,
    resolver: zodResolver(projectRecordSchema),
    mode: "onChange",
  });
  const [version, setVersion] = useState(openedVersion);
  const [save, setSave] = useState<SaveState>({ kind: "idle" });
  const bypassGuard = useRef(false);
  // Compared as JSON: a field left empty is `undefined` in the values but absent from the saved record, and both mean "not entered".
  const baseline = useRef(JSON.stringify(record));
  const [isDirty, setDirty] = useState(false);
  useEffect(() => {
    const sub = form.watch(() => setDirty(JSON.stringify(form.getValues()) !== baseline.current));
    return () => sub.unsubscribe();
  }, [form]);
  useUnsavedGuard(isDirty && canEdit, bypassGuard);
  const history = useRecordHistory(form, record);

  const submit = form.handleSubmit(
    async (values) => {
      setSave({ kind: "saving" });
      try {
        const response = await fetch(`/api/projects/${projectId}`, {
          method: "PUT",
          headers: { "content-type": "application/json", accept: "application/json" },
          body: JSON.stringify({ version, record: values }),
        });
        const body = (await response.json().catch(() => null)) as
          | { version?: number; error?: string; issues?: { path: string; message: string }[] }
          | null;
        if (response.status === 409) {
          setSave({ kind: "conflict", message: body?.error ?? "Someone saved this project after you opened it." });
          return;
        }
        if (!response.ok || typeof body?.version !== "number") {
          for (const issue of body?.issues ?? []) form.setError(issue.path as never, { type: "server", message: issue.message });
          setSave({ kind: "error", message: body?.error ?? `The server answered ${response.status}; nothing was saved.` });
          return;
        }
        setVersion(body.version);
        form.reset(values as ProjectRecordInput);
        baseline.current = JSON.stringify(form.getValues());
        setDirty(false);
        setSave({ kind: "saved", version: body.version });
        router.refresh();
      } catch {
        setSave({ kind: "error", message: "The save did not reach the server; nothing was saved. Try again." });
      }
    },
    (errors) => {
      const n = Object.keys(errors).length;
      setSave({ kind: "invalid", message: `Nothing was saved: fix the fields marked in red${n ? "" : ""} (listed in the checks panel).` });
    },
  );

  // Ctrl/⌘+S saves, as in any editor people keep open all day.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if ((e.ctrlKey || e.metaKey) && e.key.toLowerCase() === "s") {
        e.preventDefault();
        if (canEdit) void submit();
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [canEdit, submit]);

  const reload = () => {
    bypassGuard.current = true;
    window.location.reload();
  };

  return (
    <FormProvider {...form}>
      <LiveChecksProvider>
        <form
          noValidate
          aria-label="Project design"
          onSubmit={(e) => {
            e.preventDefault();
            void submit();
          }}
        >
          <div className="no-print sticky top-0 z-20 -mx-1 mb-4 flex flex-wrap items-center gap-3 border-b border-rule bg-paper/95 px-1 py-2 backdrop-blur">
            <nav aria-label="Design sections" className="flex flex-wrap gap-1 text-sm">
              {SECTIONS.map(([id, label]) => (
                <a key={id} href={`#${id}`} className="rounded-[2px] px-2 py-0.5 text-ink-soft hover:bg-slate-soft hover:text-ink">
                  {label}
                </a>
              ))}
            </nav>
            <span className="flex-1" />
            {canEdit ? (
              <span className="flex gap-1">
                <button type="button" className="btn-quiet px-2 py-0.5 text-xs" disabled={!history.canUndo} onClick={history.undo} title="Ctrl+Z">
                  Undo
                </button>
                <button type="button" className="btn-quiet px-2 py-0.5 text-xs" disabled={!history.canRedo} onClick={history.redo} title="Ctrl+Shift+Z">
                  Redo
                </button>
              </span>
            ) : null}
            <span className="figure text-xs text-ink-faint">v{version}</span>
            <span aria-live="polite" className="text-xs" data-testid="save-state">
              {save.kind === "saving"
                ? "Saving…"
                : isDirty
                  ? "Unsaved changes"
                  : save.kind === "saved"
                    ? "Saved"
                    : "No changes"}
            </span>
            <a href={`/api/projects/${projectId}/export`} download className="btn-quiet" title={isDirty ? "Exports the saved version" : undefined}>
              Export project file
            </a>
            <DuplicateProjectButton projectId={projectId} disabledReason={isDirty ? "Save first: the copy is made from the saved design" : undefined} />
            {canEdit ? (
              <SaveTemplateButton projectId={projectId} projectName={record.name} disabledReason={isDirty ? "Save first: the template is made from the saved design" : undefined} />
            ) : null}
            {canEdit ? (
              <button type="submit" className="btn" disabled={save.kind === "saving" || save.kind === "conflict"}>
                Save
              </button>
            ) : null}
          </div>

          {save.kind === "conflict" ? (
            <div role="alert" className="sheet sticky top-14 z-20 mb-4 border-l-4 border-l-signal px-4 py-3 text-sm shadow-sm">
              <p className="font-semibold">Someone saved this project after you opened it — your changes were not saved.</p>
              <p className="mt-1 text-ink-soft">
                Nothing was overwritten. Reload to see their version; the edits in this tab will be lost, so note anything you need first.
              </p>
              <button type="button" className="btn mt-2" onClick={reload}>
                Reload
              </button>
            </div>
          ) : save.kind === "invalid" || save.kind === "error" ? (
            <div role="alert" className="sheet mb-4 border-l-4 border-l-signal px-4 py-3 text-sm">
              {save.message}
            </div>
          ) : null}
          {!canEdit ? (
            <p className="sheet mb-4 px-4 py-2 text-sm text-ink-soft">Read only: your role may read this design but not change it.</p>
          ) : null}

          <div className="flex flex-col gap-4 xl:flex-row xl:items-start">
            <fieldset disabled={!canEdit} className="min-w-0 flex-1 space-y-4">
              <legend className="sr-only">Design record</legend>
              <ProjectSection />
              <SiteSection jurisdiction={record.jurisdiction} />
              <EquipmentSection />
              <ArraysSection />
              <CircuitsSection />
              <GroundingSection />
              <LoadsSection />
              <DiagramSection />
            </fieldset>
            <aside className="w-full shrink-0 xl:sticky xl:top-14 xl:w-[18rem] 2xl:w-[24rem]" aria-label="Live checks">
              <ChecksPanel projectId={projectId} canEdit={canEdit} />
            </aside>
          </div>
        </form>
      </LiveChecksProvider>
    </FormProvider>
  );
}
