"use client";

import { useActionState, useId } from "react";
import { uploadCertificateAction } from "@/app/(app)/reviews/actions";

/**
 * Uploads the reviewer's PKCS#12 signing certificate. The password is sent
 * once so the server can check that it opens the file; it is not kept.
 */
export function CertificateUpload({ hasCertificate }: { hasCertificate: boolean }) {
  const [state, action, pending] = useActionState(uploadCertificateAction, null);
  const fileId = useId();
  const passwordId = useId();
  const issueFor = (path: string) => (state && !state.ok ? state.issues.find((i) => i.path === path)?.message : undefined);
  return (
    <form action={action} aria-label="Signing certificate" className="grid gap-3">
      <div>
        <label htmlFor={fileId} className="field-label block">
          {hasCertificate ? "Replace the certificate (.p12 or .pfx)" : "Certificate file (.p12 or .pfx)"}
        </label>
        <input
          id={fileId}
          name="certificate"
          type="file"
          required
          accept=".p12,.pfx,application/x-pkcs12"
          className="mt-1 block text-sm file:mr-3 file:rounded-[2px] file:border file:border-rule file:bg-sheet file:px-3 file:py-1.5 file:text-sm"
          disabled={pending}
          aria-invalid={issueFor("certificate") ? true : undefined}
        />
        {issueFor("certificate") ? <p className="mt-1 text-sm text-signal">{issueFor("certificate")}</p> : null}
      </div>
      <div>
        <label htmlFor={passwordId} className="field-label block">
          Certificate password
        </label>
        <input
          id={passwordId}
          name="certificatePassword"
          type="password"
          required
          autoComplete="off"
          className="input mt-1 w-full max-w-xs"
          disabled={pending}
          aria-invalid={issueFor("certificatePassword") ? true : undefined}
          aria-describedby={`${passwordId}-hint`}
        />
        <p id={`${passwordId}-hint`} className="mt-1 text-xs text-ink-soft">
          Checked now and not kept. The certificate is stored encrypted; you type this password each time you sign.
        </p>
        {issueFor("certificatePassword") ? <p className="mt-1 text-sm text-signal">{issueFor("certificatePassword")}</p> : null}
      </div>
      <div>
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Checking…" : "Save certificate"}
        </button>
      </div>
      {state ? (
        <p role={state.ok ? "status" : "alert"} className={`text-sm ${state.ok ? "text-ok" : "text-signal"}`}>
          {state.ok ? state.message : state.error}
        </p>
      ) : null}
    </form>
  );
}
