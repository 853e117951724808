"use client";

import { useRouter } from "next/navigation";
import { useId, useState, useTransition } from "react";
import { signPacketAction } from "@/app/(app)/reviews/actions";

/** Signs an approved revision's stamped packet with the reviewer's stored certificate. */
export function SignPacketForm({ revisionId, subjectName }: { revisionId: string; subjectName: string }) {
  const router = useRouter();
  const id = useId();
  const [password, setPassword] = useState("");
  const [pending, startTransition] = useTransition();
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string } | null>(null);
  return (
    <form
      aria-label="Sign the stamped packet"
      className="mt-2 flex flex-wrap items-end gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        setOutcome(null);
        startTransition(async () => {
          const result = await signPacketAction(revisionId, password);
          setPassword("");
          setOutcome(result.ok ? { ok: true, text: result.message ?? "Signed." } : { ok: false, text: result.error });
          if (result.ok) router.refresh();
        });
      }}
    >
      <div>
        <label htmlFor={id} className="field-label block">
          Password of {subjectName}&apos;s certificate
        </label>
        <input id={id} type="password" autoComplete="off" required className="input mt-1 w-64" value={password} onChange={(e) => setPassword(e.target.value)} disabled={pending} />
      </div>
      <button type="submit" className="btn" disabled={pending || !password}>
        {pending ? "Signing…" : "Sign the stamped packet"}
      </button>
      {outcome ? (
        <p role={outcome.ok ? "status" : "alert"} className={`w-full text-sm ${outcome.ok ? "text-ok" : "text-signal"}`}>
          {outcome.text}
        </p>
      ) : null}
    </form>
  );
}
