'use client';

/** Opens the browser's print dialog; not shown on paper. */
export function PrintButton() {
  return (
    <button type="button" className="kf-btn kf-no-print" onClick={() => window.print()}>
      Print
    </button>
  );
}
