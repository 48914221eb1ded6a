/**
 * Whether a state-changing request provably comes from our own pages. A request that carries
 * cookies (a session) must say where it comes from: a same-origin `Origin`, or, where a browser
 * sends none, `Sec-Fetch-Site: same-origin`. A request with no cookies carries no one's authority
 * (a mail client's one-click unsubscribe posts a signed token that way), so it needs neither, but
 * is still refused when the browser says it is cross-site. Forwarded host headers count only
 * behind a proxy we trust (TRUST_PROXY=1); otherwise a client could name any host it likes.
 */
export function crossSiteReason(headers: Headers, opts: { trustProxy: boolean }): string | null {
  const site = headers.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none') return `the browser marks it ${site}`;
  const origin = headers.get('origin');
  if (origin) {
    const host = ourHost(headers, opts.trustProxy);
    let originHost: string;
    try {
      originHost = new URL(origin).host;
    } catch {
      return 'its Origin is not an address';
    }
    return host && originHost === host ? null : 'it comes from another site';
  }
  if (site === 'same-origin') return null;
  if (headers.get('cookie')) return 'it does not say which site it comes from';
  return null;
}

function ourHost(headers: Headers, trustProxy: boolean): string | null {
  const forwarded = trustProxy ? headers.get('x-forwarded-host')?.split(',')[0]?.trim() : undefined;
  return forwarded || headers.get('host');
}
