"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { renderStampedPacketAgainAction } from "@/app/(app)/reviews/actions";

export function RestampButton({ revisionId }: { revisionId: string }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <button
        type="button"
        className="btn-quiet"
        disabled={pending}
        onClick={() =>
          startTransition(async () => {
            const result = await renderStampedPacketAgainAction(revisionId);
            if (result.ok) {
              setError(null);
              router.refresh();
            } else setError(result.error);
          })
        }
      >
        {pending ? "Starting…" : "Render the stamped packet again"}
      </button>
      {error ? (
        <span role="alert" className="text-xs text-signal">
          {error}
        </span>
      ) : null}
    </span>
  );
}
