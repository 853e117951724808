"use client";

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="flex min-h-[50vh] items-center justify-center p-6">
      <div role="alert" className="sheet max-w-md border-l-4 border-l-signal px-6 py-6">
        <h1 className="text-lg font-semibold">Something went wrong</h1>
        <p className="mt-2 text-sm text-ink-soft">The page could not be shown. Nothing was changed. Try again, and tell your administrator if it keeps happening.</p>
        <button type="button" className="btn mt-4" onClick={() => reset()}>
          Try again
        </button>
      </div>
    </main>
  );
}
