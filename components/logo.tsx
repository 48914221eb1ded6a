/** Kettlefork's mark: a kettle whose spout splits in two, drawn inline so nothing is fetched. */
export function Logo({ className = 'h-8 w-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <path d="M6 12h16v11a5 5 0 0 1-5 5h-6a5 5 0 0 1-5-5z" fill="rgb(var(--kf-copper))" />
      <path d="M9 12V9a5 5 0 0 1 10 0v3" fill="none" stroke="rgb(var(--kf-ink))" strokeWidth="2" />
      <path d="M22 15l4-4M22 19l5-1" stroke="rgb(var(--kf-bine))" strokeWidth="2.2" strokeLinecap="round" />
      <circle cx="14" cy="19" r="1.6" fill="rgb(var(--kf-paper))" />
    </svg>
  );
}
