import type { Metadata } from "next";
import { BrandMark } from "@/components/ui/brand-mark";
import { VerifyForm } from "@/components/verify/verify-form";

export const metadata: Metadata = { title: "Check a stamped packet" };

/** Public: a permit counter checks a packet without an account. */
export default function VerifyPage() {
  return (
    <main className="drafting-grid flex min-h-screen items-start justify-center p-6 sm:items-center">
      <div className="w-full max-w-2xl">
        <div className="sheet">
          <div className="flex items-center gap-3 border-b-2 border-ink px-6 py-4 text-slate">
            <BrandMark size={34} />
            <div>
              <p className="text-lg font-semibold tracking-tight text-ink">Sundocket</p>
              <p className="text-xs text-ink-soft">Check a stamped permit packet</p>
            </div>
          </div>
          <div className="px-6 py-6">
            <h1 className="mb-2 text-base font-semibold">Is this the packet the reviewer stamped?</h1>
            <p className="mb-5 max-w-prose text-sm leading-relaxed text-ink-soft">
              Choose the PDF you were given, or paste its SHA-256. The answer says whether this exact file is a stamped revision, of which project, stamped by whom and when. The
              file is hashed in your browser and is not kept.
            </p>
            <VerifyForm />
          </div>
        </div>
      </div>
    </main>
  );
}
