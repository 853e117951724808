"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { attachPhotoAction } from "@/app/(app)/install/[revisionId]/actions";

/**
 * A photo of the nameplate or of the label in place, taken on site: uploaded
 * as a project photo (checked by content like every upload), then recorded
 * against the item, which counts it as done.
 */
export function SitePhoto({
  projectId,
  revisionId,
  itemKind,
  itemId,
  photoAttachmentId,
  label,
  disabled,
}: {
  projectId: string;
  revisionId: string;
  itemKind: "label" | "equipment" | "clearance";
  itemId: string;
  photoAttachmentId: string | null;
  label: string;
  disabled?: boolean;
}) {
  const inputId = useId();
  const router = useRouter();
  const [state, setState] = useState<{ busy: boolean; error?: string }>({ busy: false });

  async function upload(file: File) {
    setState({ busy: true });
    const form = new FormData();
    form.set("projectId", projectId);
    form.set("kind", "photo");
    form.set("file", file, file.name);
    try {
      const response = await fetch("/api/uploads", { method: "POST", body: form });
      const body = (await response.json().catch(() => null)) as { error?: string; attachment?: { id: string } } | null;
      if (!response.ok || !body?.attachment) throw new Error(body?.error ?? `The upload failed (${response.status}).`);
      const result = await attachPhotoAction({ revisionId, itemKind, itemId, photoAttachmentId: body.attachment.id });
      if (!result.ok) throw new Error(result.error);
      setState({ busy: false });
      router.refresh();
    } catch (error) {
      setState({ busy: false, error: (error as Error).message });
    }
  }

  return (
    <div className="flex flex-wrap items-center gap-2 text-xs">
      {photoAttachmentId ? (
        <a href={`/api/attachments/${photoAttachmentId}`} target="_blank" rel="noreferrer" className="underline decoration-rule underline-offset-2">
          Photo on file
        </a>
      ) : null}
      {disabled ? null : (
        <>
          <label htmlFor={inputId} className="btn-quiet cursor-pointer">
            {state.busy ? "Uploading…" : photoAttachmentId ? "Replace photo" : "Add photo"}
          </label>
          <input
            id={inputId}
            type="file"
            accept="image/png,image/jpeg"
            capture="environment"
            className="sr-only"
            aria-label={`Photo for ${label}`}
            disabled={state.busy}
            onChange={(event) => {
              const file = event.target.files?.[0];
              if (file) void upload(file);
              event.target.value = "";
            }}
          />
        </>
      )}
      {state.error ? (
        <span role="alert" className="text-signal">
          {state.error}
        </span>
      ) : null}
    </div>
  );
}
