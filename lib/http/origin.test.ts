import { describe, expect, it } from 'vitest';
import { crossSiteReason } from './origin';

const direct = { trustProxy: false };
const proxied = { trustProxy: true };
const h = (init: Record<string, string>) => new Headers(init);

describe('crossSiteReason', () => {
  it('lets a same-origin browser write through', () => {
    expect(crossSiteReason(h({ host: 'brew.test', origin: 'https://brew.test', cookie: 's=1' }), direct)).toBeNull();
    expect(
      crossSiteReason(h({ host: 'brew.test', 'sec-fetch-site': 'same-origin', cookie: 's=1' }), direct),
    ).toBeNull();
  });

  it('refuses a cookie-carrying write that names no origin', () => {
    expect(crossSiteReason(h({ host: 'brew.test', cookie: 's=1' }), direct)).toMatch(/does not say/);
  });

  it('refuses another origin, a malformed one and a browser-marked cross-site request', () => {
    expect(
      crossSiteReason(h({ host: 'brew.test', origin: 'https://evil.test', cookie: 's=1' }), direct),
    ).not.toBeNull();
    expect(crossSiteReason(h({ host: 'brew.test', origin: 'null', cookie: 's=1' }), direct)).not.toBeNull();
    expect(crossSiteReason(h({ host: 'brew.test', 'sec-fetch-site': 'cross-site' }), direct)).not.toBeNull();
    expect(
      crossSiteReason(h({ host: 'brew.test', 'sec-fetch-site': 'same-site', cookie: 's=1' }), direct),
    ).not.toBeNull();
  });

  it('lets a cookieless request without Origin through (a mail client unsubscribing)', () => {
    expect(crossSiteReason(h({ host: 'brew.test' }), direct)).toBeNull();
  });

  it('believes X-Forwarded-Host only behind a trusted proxy', () => {
    const forged = h({
      host: 'brew.test',
      'x-forwarded-host': 'evil.test',
      origin: 'https://evil.test',
      cookie: 's=1',
    });
    expect(crossSiteReason(forged, direct)).not.toBeNull();
    expect(crossSiteReason(forged, proxied)).toBeNull();
    const behindProxy = h({ host: '127.0.0.1:3000', 'x-forwarded-host': 'brew.test', origin: 'https://brew.test' });
    expect(crossSiteReason(behindProxy, proxied)).toBeNull();
    expect(crossSiteReason(behindProxy, direct)).not.toBeNull();
  });
});
