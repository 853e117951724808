"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { fetchJson } from "@/lib/fetch-json";
import type { AttachmentView } from "@/lib/services/attachments/view";
import { formatBytes } from "@/lib/uploads/format-bytes";
import { KIND_RULES, type AttachmentKind } from "@/lib/uploads/kinds";

/** Twelve hex digits: enough to tell files apart by eye and to find one in a packet's document index. */
const SHA_PREFIX = 12;

export function AttachmentList({
  attachments,
  canDelete,
  linkableKinds,
  equipmentTags,
}: {
  attachments: AttachmentView[];
  canDelete: boolean;
  /** Kinds the viewer may attach, and so re-link. */
  linkableKinds: readonly AttachmentKind[];
  equipmentTags: string[];
}) {
  if (attachments.length === 0) {
    return <p className="sheet px-4 py-8 text-center text-sm text-ink-soft">No files attached yet. Datasheets, the site plan and listings added above appear here.</p>;
  }
  return (
    <div className="sheet overflow-x-auto">
      <table className="data-table" aria-label="Attachments">
        <thead>
          <tr>
            <th>File</th>
            <th>Kind</th>
            <th>Equipment</th>
            <th className="text-right">Pages</th>
            <th className="text-right">Size</th>
            <th>SHA-256</th>
            <th>Added</th>
            <th>
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {attachments.map((a) => (
            <AttachmentRow key={a.id} attachment={a} canDelete={canDelete} canLink={linkableKinds.includes(a.kind)} equipmentTags={equipmentTags} />
          ))}
        </tbody>
      </table>
    </div>
  );
}

function AttachmentRow({
  attachment: a,
  canDelete,
  canLink,
  equipmentTags,
}: {
  attachment: AttachmentView;
  canDelete: boolean;
  canLink: boolean;
  equipmentTags: string[];
}) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const kept = a.usedByRevisions.length > 0;

  async function link(tag: string) {
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/attachments/${a.id}`, {
        method: "PATCH",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ equipmentTag: tag || null }),
      });
      router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : "The link was not changed.");
    } finally {
      setBusy(false);
    }
  }

  async function remove() {
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/attachments/${a.id}`, { method: "DELETE" });
      router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : "The file was not deleted.");
      setConfirming(false);
    } finally {
      setBusy(false);
    }
  }

  return (
    <tr>
      <td className="max-w-[18rem]">
        <a href={a.downloadUrl} className="break-words font-medium underline decoration-rule underline-offset-2 hover:decoration-ink" download={a.fileName}>
          {a.fileName}
          <span className="sr-only"> (download)</span>
        </a>
        {error ? (
          <p role="alert" className="mt-1 border-l-4 border-l-signal pl-2 text-xs text-signal">
            {error}
          </p>
        ) : null}
      </td>
      <td>{KIND_RULES[a.kind].label}</td>
      <td className="figure">
        {canLink && equipmentTags.length > 0 ? (
          <select
            className="input w-auto py-0.5 text-sm"
            aria-label={`Equipment for ${a.fileName}`}
            value={a.equipmentTag ?? ""}
            disabled={busy}
            onChange={(e) => link(e.target.value)}
          >
            {KIND_RULES[a.kind].equipment === "required" ? null : <option value="">—</option>}
            {a.equipmentTag && !equipmentTags.includes(a.equipmentTag) ? <option value={a.equipmentTag}>{a.equipmentTag} (not in the design)</option> : null}
            {equipmentTags.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </select>
        ) : (
          (a.equipmentTag ?? <span className="text-ink-faint">—</span>)
        )}
      </td>
      <td className="figure text-right">{a.pageCount ?? <span className="text-ink-faint" title="Images are drawn onto a sheet">image</span>}</td>
      <td className="figure whitespace-nowrap text-right">{formatBytes(a.sizeBytes)}</td>
      <td className="figure text-xs">
        <abbr title={a.sha256} className="no-underline">
          {a.sha256.slice(0, SHA_PREFIX)}…
        </abbr>
      </td>
      <td className="whitespace-nowrap text-xs text-ink-soft">
        <span className="figure">{a.createdAt.slice(0, 10)}</span>
        {a.uploadedByName ? <span className="block">{a.uploadedByName}</span> : null}
      </td>
      <td className="whitespace-nowrap text-right">
        {kept ? (
          <span className="text-xs text-ink-soft" title="A packet revision keeps the files it was generated from.">
            In {a.usedByRevisions.map((n) => `Rev ${n}`).join(", ")}
          </span>
        ) : canDelete ? (
          confirming ? (
            <span className="inline-flex items-center gap-1">
              <button type="button" className="btn-quiet border-signal text-signal" onClick={remove} disabled={busy} aria-label={`Confirm delete ${a.fileName}`}>
                {busy ? "Deleting…" : "Delete"}
              </button>
              <button type="button" className="btn-quiet" onClick={() => setConfirming(false)} disabled={busy}>
                Keep
              </button>
            </span>
          ) : (
            <button type="button" className="btn-quiet" onClick={() => setConfirming(true)} aria-label={`Delete ${a.fileName}`}>
              Delete…
            </button>
          )
        ) : null}
      </td>
    </tr>
  );
}
