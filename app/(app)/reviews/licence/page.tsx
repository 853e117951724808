import type { Metadata } from "next";
import Link from "next/link";
import { LicenceForm } from "@/components/reviews/licence-form";
import { CertificateUpload } from "@/components/reviews/certificate-upload";
import { StampUpload } from "@/components/reviews/stamp-upload";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { getOwnCertificate, getOwnLicence, STAMP_MIN_PX } from "@/lib/services/reviews";

export const metadata: Metadata = { title: "Your licence and stamp" };

const STANDING_WORDS = {
  valid: { shape: "●", word: "Valid", className: "text-ok" },
  "expires-soon": { shape: "▲", word: "Expires soon", className: "text-caution" },
  expired: { shape: "■", word: "Expired", className: "text-signal" },
  "no-expiry": { shape: "◇", word: "No expiry date recorded", className: "text-query" },
} as const;

export default async function LicencePage() {
  const { ctx, allowed } = await pageContext("licence:edit-own");
  if (!allowed) return <Refusal message="A licence record and stamp are kept by licensed reviewers." />;
  const licence = getOwnLicence(ctx);
  const certificate = getOwnCertificate(ctx);
  const today = new Date().toISOString().slice(0, 10);
  const standing = licence ? STANDING_WORDS[licence.standing] : null;

  return (
    <>
      <PageHeader title="Your licence and stamp" sheet={ctx.user.name}>
        <Link href="/reviews" className="btn-quiet">
          Review queue
        </Link>
      </PageHeader>
      <p className="mb-6 max-w-prose text-sm leading-relaxed text-ink-soft">
        When you approve a revision, this licence is copied into the approval as it stands that day and printed, with your name, the date and your stamp image, on every
        page of the packet. Keep it current: an expired licence cannot approve anything.
      </p>

      {licence && standing ? (
        <section aria-label="Standing" className="sheet mb-6 flex flex-wrap items-center gap-x-8 gap-y-2 px-5 py-3 text-sm">
          <p className={`font-semibold ${standing.className}`}>
            <span aria-hidden="true">{standing.shape} </span>
            {standing.word}
            {licence.daysLeft !== null && licence.daysLeft >= 0 ? (
              <span className="figure font-normal text-ink-soft">
                {" "}
                · {licence.daysLeft} day{licence.daysLeft === 1 ? "" : "s"} left
              </span>
            ) : null}
          </p>
          <p>
            {licence.blockers.length ? (
              <span className="text-signal">Cannot approve yet: {licence.blockers.join("; ")}.</span>
            ) : (
              <span className="text-ok">Ready to approve and stamp.</span>
            )}
          </p>
        </section>
      ) : null}

      <div className="grid gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <section aria-labelledby="licence-heading">
          <h2 id="licence-heading" className="mb-3 text-base font-semibold tracking-tight">
            Licence record
          </h2>
          <LicenceForm licence={licence} today={today} />
        </section>
        <section aria-labelledby="stamp-heading">
          <h2 id="stamp-heading" className="mb-3 text-base font-semibold tracking-tight">
            Stamp
          </h2>
          <div className="sheet px-5 py-5">
            {licence?.stamp ? (
              <figure className="mb-4">
                <img src={licence.stamp.url} alt={`Your stamp image, ${licence.stamp.fileName}`} className="h-40 w-40 border border-grid bg-white object-contain p-2" />
                <figcaption className="mt-1 text-xs text-ink-soft">
                  {licence.stamp.fileName} · uploaded <span className="figure">{licence.stamp.uploadedAt.slice(0, 10)}</span>
                </figcaption>
              </figure>
            ) : (
              <p className="mb-4 text-sm text-ink-soft">{licence ? "No stamp image on file yet." : "Record your licence first; the stamp belongs to it."}</p>
            )}
            <StampUpload hasStamp={Boolean(licence?.stamp)} disabled={!licence} minPx={STAMP_MIN_PX} />
          </div>
        </section>
        <section aria-labelledby="certificate-heading" className="lg:col-start-2">
          <h2 id="certificate-heading" className="mb-3 text-base font-semibold tracking-tight">
            Signing certificate
          </h2>
          <div className="sheet px-5 py-5">
            {certificate ? (
              <dl className="mb-4 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" data-testid="certificate-on-file">
                <dt className="text-ink-soft">Issued to</dt>
                <dd>{certificate.subjectName}</dd>
                <dt className="text-ink-soft">Issued by</dt>
                <dd>{certificate.issuerName}</dd>
                <dt className="text-ink-soft">Valid until</dt>
                <dd className="figure">{certificate.notAfter.slice(0, 10)}</dd>
                <dt className="text-ink-soft">SHA-256</dt>
                <dd className="figure break-all text-xs">{certificate.fingerprintSha256}</dd>
              </dl>
            ) : (
              <p className="mb-4 text-sm text-ink-soft">
                No certificate on file. With one, each packet you approve is digitally signed, so any PDF reader shows who sealed it and that nothing changed since.
              </p>
            )}
            <CertificateUpload hasCertificate={Boolean(certificate)} />
          </div>
        </section>
      </div>
    </>
  );
}
