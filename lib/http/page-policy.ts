/**
 * The Content-Security-Policy of an HTML page; `scripts` are the sources that let the framework's own
 * inline scripts run (a per-request nonce, or the hashes of a kept page's inline scripts).
 */
export function pagePolicy(scripts: string): string {
  const dev = process.env.NODE_ENV === 'development';
  return [
    "default-src 'self'",
    `script-src 'self' ${scripts}${dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self' data:",
    "connect-src 'self'",
    // Brew-day mode's service worker (public/brew-day-sw.js); 'strict-dynamic' would otherwise refuse it.
    "worker-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}
