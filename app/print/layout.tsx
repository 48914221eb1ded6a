import './print.css';
import type { ReactNode } from 'react';

/** Printable pages: outside the site's page groups, so without its header, footer and navigation. */
export default function PrintLayout({ children }: { children: ReactNode }) {
  return <main className="kf-print-page">{children}</main>;
}
