import { BrandMark } from "@/components/ui/brand-mark";

/** The drawing-sheet frame of the signed-out pages: sign in, ask for a reset link, choose a password. */
export function AuthSheet({ title, sheet, children }: { title: string; sheet: string; children: React.ReactNode }) {
  return (
    <main className="drafting-grid flex min-h-screen items-center justify-center p-6">
      <div className="w-full max-w-sm">
        <div className="sheet">
          <div className="flex items-center gap-3 border-b-2 border-ink px-6 py-4 text-slate">
            <BrandMark size={34} />
            <div>
              <p className="text-lg font-semibold tracking-tight text-ink">Sundocket</p>
              <p className="text-xs text-ink-soft">Code checks and permit packets for solar + storage</p>
            </div>
          </div>
          <div className="px-6 py-6">
            <h1 className="mb-4 text-base font-semibold">{title}</h1>
            {children}
          </div>
          <div className="grid grid-cols-3 border-t border-rule text-[10px] uppercase tracking-wider text-ink-faint">
            <span className="border-r border-rule px-3 py-1.5">Sheet {sheet}</span>
            <span className="border-r border-rule px-3 py-1.5">Access</span>
            <span className="px-3 py-1.5">Rev —</span>
          </div>
        </div>
        <p className="mt-4 text-center text-xs text-ink-soft">Checks assist the licensed professional; the AHJ and local codes govern.</p>
      </div>
    </main>
  );
}
