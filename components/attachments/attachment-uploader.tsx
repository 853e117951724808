"use client";

import Uppy, { type Body, type Meta, type UppyFile } from "@uppy/core";
import Dashboard from "@uppy/react/dashboard";
import XHRUpload from "@uppy/xhr-upload";
import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState } from "react";
import "@uppy/core/css/style.min.css";
import "@uppy/dashboard/css/style.min.css";
import "./uploader.css";
import { formatBytes } from "@/lib/uploads/format-bytes";
import { describeAccepted, KIND_RULES, type AttachmentKind } from "@/lib/uploads/kinds";

export interface EquipmentOption {
  tag: string;
  description: string;
  kind: string;
  /** Kinds of document already linked to it. */
  documented: string[];
}

interface UploadMeta extends Meta {
  projectId: string;
  kind: AttachmentKind;
  equipmentTag: string;
}

interface UploadAnswer extends Body {
  duplicate?: boolean;
  message?: string;
  attachment?: { id: string; pageCount: number | null };
}

type Outcome = { id: string; fileName: string; target: string; state: "attached" | "duplicate" | "refused"; message: string };

const ACCEPT_BY_MIME: Record<string, string[]> = {
  "application/pdf": [".pdf", "application/pdf"],
  "image/png": [".png", "image/png"],
  "image/jpeg": [".jpg", ".jpeg", "image/jpeg"],
};

function allowedTypes(kind: AttachmentKind): string[] {
  return KIND_RULES[kind].accepts.flatMap((m) => ACCEPT_BY_MIME[m] ?? []);
}

function targetOf(meta: { kind?: unknown; equipmentTag?: unknown }): string {
  const kind = typeof meta.kind === "string" && Object.hasOwn(KIND_RULES, meta.kind) ? KIND_RULES[meta.kind as AttachmentKind].label : "File";
  return typeof meta.equipmentTag === "string" && meta.equipmentTag ? `${kind} for ${meta.equipmentTag}` : kind;
}

/** The server's refusal from its JSON answer; XHR errors from the network say nothing a person can act on. */
function messageFromResponse(xhr: XMLHttpRequest): string {
  try {
    const body = JSON.parse(xhr.responseText) as { error?: unknown };
    if (typeof body.error === "string" && body.error) return body.error;
  } catch {
    // not JSON: fall through to the status
  }
  if (xhr.status === 413) return "The file is larger than the server accepts.";
  return `The server answered ${xhr.status}${xhr.statusText ? ` ${xhr.statusText}` : ""}. Nothing was attached.`;
}

export function AttachmentUploader({
  projectId,
  kinds,
  equipment,
  maxBytes,
}: {
  projectId: string;
  kinds: AttachmentKind[];
  equipment: EquipmentOption[];
  maxBytes: number;
}) {
  const router = useRouter();
  const ids = useId();
  // The equipment a document of this kind can be linked to, and the first of them still without one.
  const optionsFor = (k: AttachmentKind) => {
    const allowed = KIND_RULES[k].equipmentKinds;
    return allowed ? equipment.filter((e) => allowed.includes(e.kind)) : equipment;
  };
  const nextFor = (k: AttachmentKind) => {
    if (KIND_RULES[k].equipment !== "required") return "";
    const options = optionsFor(k);
    return (options.find((e) => !e.documented.includes(k)) ?? options[0])?.tag ?? "";
  };
  const firstKind = kinds[0] ?? "other";
  const [kind, setKind] = useState<AttachmentKind>(firstKind);
  const [equipmentTag, setEquipmentTag] = useState<string>(() => nextFor(firstKind));
  // After an upload the choice moves on to the next equipment lacking this document, rather than keeping the last one.
  const advance = useRef(false);
  const documentedKey = equipment.map((e) => `${e.tag}:${e.documented.join(",")}`).join(";");
  useEffect(() => {
    if (!advance.current) return;
    advance.current = false;
    setEquipmentTag(nextFor(kind));
  }, [documentedKey]);
  const [outcomes, setOutcomes] = useState<Outcome[]>([]);

  // One instance for the component's life (React may run effects twice in development, so it is not destroyed in a cleanup).
  const [uppy] = useState(
    () =>
      new Uppy<UploadMeta, UploadAnswer>({
        id: `attachments-${projectId}`,
        autoProceed: true,
        // Refusals are expected answers, shown in the list below; they are not page errors.
        logger: { debug: () => {}, warn: (...args: unknown[]) => console.warn(...args), error: (...args: unknown[]) => console.warn(...args) },
        allowMultipleUploadBatches: true,
        restrictions: { maxFileSize: maxBytes, allowedFileTypes: allowedTypes(kinds[0] ?? "other") },
        meta: { projectId, kind: firstKind, equipmentTag: nextFor(firstKind) },
      }).use(XHRUpload<UploadMeta, UploadAnswer>, {
        endpoint: "/api/uploads",
        fieldName: "file",
        formData: true,
        allowedMetaFields: ["projectId", "kind", "equipmentTag"],
        limit: 2,
        // A refusal (4xx) will not change on a second try; the network and the server's own failures may.
        shouldRetry: (xhr) => xhr.status === 0 || xhr.status >= 500,
        onAfterResponse: (xhr) => {
          if (xhr.status >= 400) throw new Error(messageFromResponse(xhr));
        },
      }),
  );

  const rule = KIND_RULES[kind];
  const needsTag = rule.equipment === "required";
  const blocked = needsTag && !equipmentTag;

  useEffect(() => {
    uppy.setMeta({ projectId, kind, equipmentTag: rule.equipment === "required" || equipmentTag ? equipmentTag : "" });
    uppy.setOptions({
      restrictions: { maxFileSize: maxBytes, allowedFileTypes: allowedTypes(kind) },
      locale: {
        strings: {
          youCanOnlyUploadFileTypes: `A ${rule.label.toLowerCase()} must be ${describeAccepted(kind)}; choose another kind for other files.`,
          exceedsSize: "“%{file}” is larger than the largest file accepted, %{size}. Reduce it (for a scan, a lower resolution) or split it.",
          noDuplicates: "“%{fileName}” is already in the uploader.",
        },
      },
    });
  }, [uppy, projectId, kind, equipmentTag, maxBytes, rule.equipment, rule.label]);

  useEffect(() => {
    const refusedIds = new Set<string>();
    const record = (file: UppyFile<UploadMeta, UploadAnswer> | undefined, state: Outcome["state"], message: string) => {
      if (!file) return;
      setOutcomes((prev) => [{ id: file.id, fileName: file.name ?? "file", target: targetOf(file.meta), state, message }, ...prev.filter((o) => o.id !== file.id)].slice(0, 20));
    };
    const onSuccess = (file: UppyFile<UploadMeta, UploadAnswer> | undefined, response: { body?: UploadAnswer }) => {
      const body = response.body;
      record(file, body?.duplicate ? "duplicate" : "attached", body?.message ?? "Attached.");
    };
    const onError = (file: UppyFile<UploadMeta, UploadAnswer> | undefined, error: { message: string }, response?: { status?: number }) => {
      const status = response?.status ?? (error as { request?: XMLHttpRequest }).request?.status ?? 0;
      const offline = status === 0;
      record(file, "refused", offline ? "The connection was lost before the file arrived. Use Retry in the uploader." : error.message);
      if (file && status >= 400 && status < 500) refusedIds.add(file.id);
    };
    const onRestriction = (file: UppyFile<UploadMeta, UploadAnswer> | undefined, error: Error) => {
      record(file, "refused", error.message);
    };
    const onComplete = () => {
      // A refusal will not change on a second try, so the file leaves the uploader instead of offering Retry; its message stays below.
      if (refusedIds.size > 0) {
        for (const id of refusedIds) if (uppy.getFile(id)) uppy.removeFile(id);
        refusedIds.clear();
        // The status bar would still say "Upload failed" for files no longer shown; retryable failures keep it.
        if (!uppy.getFiles().some((f) => f.error)) uppy.setState({ error: null });
      }
      advance.current = true;
      router.refresh();
    };
    uppy.on("upload-success", onSuccess);
    uppy.on("upload-error", onError);
    uppy.on("restriction-failed", onRestriction);
    uppy.on("complete", onComplete);
    return () => {
      uppy.off("upload-success", onSuccess);
      uppy.off("upload-error", onError);
      uppy.off("restriction-failed", onRestriction);
      uppy.off("complete", onComplete);
    };
  }, [uppy, router]);

  function chooseKind(next: AttachmentKind) {
    setKind(next);
    // A new kind starts from its own first undocumented equipment (a storage listing from a battery), never the last kind's choice.
    setEquipmentTag(nextFor(next));
  }

  const refused = outcomes.filter((o) => o.state === "refused");
  const done = outcomes.filter((o) => o.state !== "refused");

  return (
    <section aria-labelledby={`${ids}-title`} className="sheet">
      <header className="border-b border-rule px-4 py-2">
        <h2 id={`${ids}-title`} className="text-sm font-semibold">
          Add files
        </h2>
        <p className="text-xs text-ink-soft">
          Choose what the file is, then drop it below. Each file is checked by its content and uploaded as soon as it is added.
        </p>
      </header>
      <div className="grid gap-3 px-4 py-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <div>
          <label htmlFor={`${ids}-kind`} className="field-label">
            Kind
          </label>
          <select id={`${ids}-kind`} className="input mt-1" value={kind} onChange={(e) => chooseKind(e.target.value as AttachmentKind)}>
            {kinds.map((k) => (
              <option key={k} value={k}>
                {KIND_RULES[k].label}
              </option>
            ))}
          </select>
          <p className="mt-1 text-xs text-ink-soft">{rule.hint}</p>
        </div>
        <div>
          <label htmlFor={`${ids}-tag`} className="field-label">
            Equipment {needsTag ? "(required)" : "(optional)"}
          </label>
          <select
            id={`${ids}-tag`}
            className="input mt-1"
            value={equipmentTag}
            aria-invalid={blocked ? "true" : undefined}
            aria-describedby={`${ids}-tag-help`}
            onChange={(e) => setEquipmentTag(e.target.value)}
          >
            {needsTag ? null : <option value="">— not linked to equipment —</option>}
            {needsTag && !equipmentTag ? <option value="">— choose equipment —</option> : null}
            {optionsFor(kind).map((e) => (
              <option key={e.tag} value={e.tag}>
                {e.tag} · {e.description}
                {needsTag && e.documented.includes(kind) ? ` (has a ${rule.label.toLowerCase()})` : ""}
              </option>
            ))}
          </select>
          <p id={`${ids}-tag-help`} className="mt-1 text-xs text-ink-soft">
            {optionsFor(kind).length === 0
              ? rule.equipmentKinds
                ? `This project has no ${rule.equipmentKinds.join(" or ")} yet: add it on the Design tab first.`
                : "This project has no equipment yet: add it on the Design tab to attach datasheets."
              : needsTag
                ? `The submittal check counts one ${rule.label.toLowerCase()} per ${rule.equipmentKinds ? rule.equipmentKinds.join(" or ") : "equipment tag"}.`
                : "Link a photo or listing to the equipment it shows, if any."}
          </p>
        </div>
      </div>

      <div className="attachment-uploader px-4 pb-3">
        <Dashboard
          uppy={uppy}
          id={`attachments-dashboard`}
          height={260}
          width="100%"
          theme="light"
          disabled={blocked}
          proudlyDisplayPoweredByUppy={false}
          hideProgressDetails={false}
          hideRetryButton={false}
          showRemoveButtonAfterComplete
          aria-label="File uploader"
        />
        <p className="mt-1 text-xs text-ink-soft">
          {blocked
            ? "Choose the equipment this datasheet documents first."
            : `${rule.label}${needsTag && equipmentTag ? ` for ${equipmentTag}` : ""}: ${describeAccepted(kind)}, up to ${formatBytes(maxBytes)} each.`}
        </p>
      </div>

      <div aria-live="polite" className="px-4 pb-4">
        {refused.length > 0 ? (
          <div role="alert" className="mb-2 border-l-4 border-l-signal bg-signal-soft px-3 py-2 text-sm">
            <p className="font-semibold">
              <span aria-hidden="true">■ </span>
              {refused.length === 1 ? "1 file was not attached" : `${refused.length} files were not attached`}
            </p>
            <ul className="mt-1 space-y-1">
              {refused.map((o) => (
                <li key={o.id}>
                  <span className="text-ink-soft">{o.target}: </span>
                  {o.message.includes(o.fileName) ? o.message : `“${o.fileName}”: ${o.message}`}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
        {done.length > 0 ? (
          <ul className="space-y-1 text-sm" aria-label="Upload results">
            {done.map((o) => (
              <li key={o.id} className={o.state === "duplicate" ? "text-caution" : "text-ok"}>
                <span aria-hidden="true">{o.state === "duplicate" ? "▲ " : "● "}</span>
                <span className="text-ink">{o.message}</span>
              </li>
            ))}
          </ul>
        ) : null}
        {outcomes.length > 0 ? (
          <button type="button" className="btn-quiet mt-2 text-xs" onClick={() => setOutcomes([])}>
            Clear messages
          </button>
        ) : null}
      </div>
    </section>
  );
}
