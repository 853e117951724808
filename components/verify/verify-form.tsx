"use client";

import { useId, useState } from "react";
import type { VerifyAnswer } from "@/lib/services/verify/stamped-file";

async function sha256Of(file: File): Promise<string | null> {
  // crypto.subtle exists only in secure contexts (https, localhost); elsewhere the file is sent to be hashed.
  if (!globalThis.crypto?.subtle) return null;
  const digest = await crypto.subtle.digest("SHA-256", await file.arrayBuffer());
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, "0")).join("");
}

/** Checks one file against the stamped packets: hashed in the browser when it can be, so the file need not be sent. */
export function VerifyForm() {
  const fileId = useId();
  const hashId = useId();
  const [hash, setHash] = useState("");
  const [pending, setPending] = useState(false);
  const [result, setResult] = useState<VerifyAnswer | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function ask(request: Promise<Response>) {
    setPending(true);
    setError(null);
    setResult(null);
    try {
      const response = await request;
      const json = (await response.json().catch(() => null)) as (VerifyAnswer & { error?: string }) | null;
      if (!response.ok || !json) throw new Error(json?.error ?? `The server answered ${response.status}.`);
      setResult(json);
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setPending(false);
    }
  }

  async function checkFile(file: File) {
    const sha = await sha256Of(file);
    if (sha) {
      setHash(sha);
      await ask(fetch(`/api/verify?sha256=${sha}`, { headers: { accept: "application/json" } }));
    } else {
      await ask(fetch("/api/verify", { method: "POST", body: file, headers: { "content-type": "application/pdf", accept: "application/json" } }));
    }
  }

  return (
    <div className="grid gap-5">
      <div>
        <label htmlFor={fileId} className="field-label block">
          The packet PDF
        </label>
        <input
          id={fileId}
          type="file"
          accept="application/pdf,.pdf"
          className="mt-1 block text-sm file:mr-3 file:rounded-[2px] file:border file:border-rule file:bg-sheet file:px-3 file:py-1.5 file:text-sm"
          disabled={pending}
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) void checkFile(file);
          }}
        />
      </div>
      <form
        className="grid gap-1"
        onSubmit={(e) => {
          e.preventDefault();
          void ask(fetch(`/api/verify?sha256=${encodeURIComponent(hash.trim().toLowerCase())}`, { headers: { accept: "application/json" } }));
        }}
      >
        <label htmlFor={hashId} className="field-label block">
          Or its SHA-256
        </label>
        <div className="flex flex-wrap gap-2">
          <input id={hashId} className="input figure w-full max-w-xl text-xs" value={hash} onChange={(e) => setHash(e.target.value)} spellCheck={false} autoComplete="off" disabled={pending} />
          <button type="submit" className="btn" disabled={pending || !hash.trim()}>
            Check
          </button>
        </div>
      </form>
      {pending ? (
        <p role="status" className="text-sm text-ink-soft">
          Checking…
        </p>
      ) : null}
      {error ? (
        <p role="alert" className="text-sm text-signal">
          {error}
        </p>
      ) : null}
      {result?.stamped ? (
        <div role="status" className="border-l-4 border-l-ok px-4 py-3 text-sm" data-testid="verify-result">
          <p className="font-semibold">
            <span aria-hidden="true">● </span>This exact file is a stamped packet.
          </p>
          <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="text-ink-soft">Project</dt>
            <dd>
              {result.projectName}, revision {result.revisionNumber}
            </dd>
            <dt className="text-ink-soft">Stamped by</dt>
            <dd>
              {result.reviewerName}
              {result.licenceNumber ? `, licence ${result.licenceNumber}` : ""}
              {result.licenceRegion ? ` (${result.licenceRegion})` : ""}
            </dd>
            <dt className="text-ink-soft">Approved</dt>
            <dd className="figure">{result.approvedAt.slice(0, 10)}</dd>
            <dt className="text-ink-soft">Digital signature</dt>
            <dd>{result.signature ? `${result.signature.subjectName}, signed ${result.signature.signedAt.slice(0, 16).replace("T", " ")} UTC` : "none"}</dd>
          </dl>
        </div>
      ) : null}
      {result && !result.stamped ? (
        <div role="status" className="border-l-4 border-l-signal px-4 py-3 text-sm" data-testid="verify-result">
          <p className="font-semibold">
            <span aria-hidden="true">■ </span>This file is not a stamped packet.
          </p>
          <p className="mt-1 text-ink-soft">
            No stamped revision has exactly this content. A copy changed in any way, even re-saved or printed to PDF again, does not match; ask the applicant for the file as issued.
          </p>
        </div>
      ) : null}
    </div>
  );
}
