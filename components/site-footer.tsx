import Link from 'next/link';

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-line">
      <div className="mx-auto max-w-page px-4 py-6 font-sans text-sm text-muted">
        <p>
          Kettlefork is a place to share homebrew recipes. Brewing involves boiling liquids, pressurised CO2 and
          cleaning chemicals: follow your equipment maker&apos;s limits and local codes, and please drink responsibly.
        </p>
        <p className="mt-2">
          <Link href="/about">About Kettlefork</Link>
        </p>
      </div>
    </footer>
  );
}
