import Link from "next/link";

export default function NotFound() {
  return (
    <main className="drafting-grid flex min-h-screen items-center justify-center p-6">
      <div className="sheet max-w-md px-6 py-6">
        <p className="figure text-xs text-ink-faint">404</p>
        <h1 className="text-lg font-semibold">Not found</h1>
        <p className="mt-2 text-sm text-ink-soft">There is nothing here, or it belongs to another organisation.</p>
        <Link href="/" className="btn mt-4">
          Back to your work
        </Link>
      </div>
    </main>
  );
}
