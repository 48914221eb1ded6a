import './print.css';
import type { ReactNode } from 'react';

/** Printable pages: the site's header, footer and skip link are hidden around them (see print.css). */
export default function PrintLayout({ children }: { children: ReactNode }) {
  return <div className="kf-print-page">{children}</div>;
}
