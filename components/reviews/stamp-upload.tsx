"use client";

import { useRouter } from "next/navigation";
import { useId, useRef, useState } from "react";
import { RequestError } from "@/lib/fetch-json";

/** Uploads the reviewer's stamp image (PNG or JPEG); the server checks it by content and by size in pixels. */
export function StampUpload({ hasStamp, disabled, minPx }: { hasStamp: boolean; disabled?: boolean; minPx: number }) {
  const router = useRouter();
  const inputId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const [pending, setPending] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; text: string } | null>(null);

  async function upload(file: File) {
    setPending(true);
    setResult(null);
    try {
      const body = new FormData();
      body.set("file", file);
      const response = await fetch("/api/reviews/licence/stamp", { method: "POST", body, headers: { accept: "application/json" } });
      const json = (await response.json().catch(() => null)) as { message?: string; error?: string } | null;
      if (!response.ok) throw new RequestError(json?.error ?? `The server answered ${response.status}.`, response.status);
      setResult({ ok: true, text: json?.message ?? "Stamp image saved." });
      router.refresh();
    } catch (error) {
      setResult({ ok: false, text: error instanceof Error ? error.message : String(error) });
    } finally {
      setPending(false);
      if (inputRef.current) inputRef.current.value = "";
    }
  }

  return (
    <div>
      <label htmlFor={inputId} className="field-label block">
        {hasStamp ? "Replace the stamp image" : "Stamp image"}
      </label>
      <input
        id={inputId}
        ref={inputRef}
        type="file"
        accept="image/png,image/jpeg"
        className="mt-1 block text-sm file:mr-3 file:rounded-[2px] file:border file:border-rule file:bg-sheet file:px-3 file:py-1.5 file:text-sm"
        disabled={disabled || pending}
        aria-describedby={`${inputId}-hint`}
        onChange={(e) => {
          const file = e.target.files?.[0];
          if (file) void upload(file);
        }}
      />
      <p id={`${inputId}-hint`} className="mt-1 text-xs text-ink-soft">
        PNG or JPEG, at least {minPx} × {minPx} px, on a white or transparent ground. It is printed on every page of each packet you approve.
      </p>
      {pending ? (
        <p role="status" className="mt-1 text-sm text-ink-soft">
          Uploading…
        </p>
      ) : null}
      {result ? (
        <p role={result.ok ? "status" : "alert"} className={`mt-1 text-sm ${result.ok ? "text-ok" : "text-signal"}`}>
          {result.text}
        </p>
      ) : null}
    </div>
  );
}
