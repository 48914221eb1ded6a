'use client';

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="mx-auto max-w-md py-10 text-center" role="alert">
      <h1 className="text-3xl font-semibold">Something went wrong</h1>
      <p className="mt-3 text-muted">
        Kettlefork could not show this page just now. Please try again in a moment.
        {error.digest && <span className="kf-data mt-2 block text-xs">Reference: {error.digest}</span>}
      </p>
      <button type="button" className="kf-btn mt-6" onClick={reset}>
        Try again
      </button>
    </div>
  );
}
