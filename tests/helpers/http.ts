import { BASE_URL } from './env';

let clientCounter = 0;

const STALE_SOCKET = new Set(['EPIPE', 'ECONNRESET', 'UND_ERR_SOCKET']);

/**
 * fetch, tried once more when a kept-alive connection turns out to have been closed by the server
 * just as the request went out: nothing reached the app, so sending it again is safe.
 */
async function fetchOnce(url: URL, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, init);
  } catch (err) {
    const code = (err as { cause?: { code?: string } }).cause?.code;
    if (!code || !STALE_SOCKET.has(code)) throw err;
    return fetch(url, init);
  }
}

export interface JsonResponse<T = unknown> {
  status: number;
  body: T;
  headers: Headers;
}

/**
 * A browser-like HTTP client for the app under test: keeps cookies, sends same-origin requests,
 * and has an address of its own so rate limits per address do not leak between tests.
 */
export class TestClient {
  private cookies = new Map<string, string>();
  readonly address: string;

  /**
   * `base`: the app's address, for scripts that start an app of their own (the page bench, the
   * mixed-traffic run), which may run one after another in one process.
   */
  constructor(
    address?: string,
    readonly base: string = BASE_URL,
  ) {
    clientCounter += 1;
    this.address = address ?? `10.${process.pid % 250}.${Math.floor(clientCounter / 250)}.${clientCounter % 250}`;
  }

  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  hasCookie(name: string): boolean {
    return this.cookies.has(name);
  }

  private remember(res: Response): void {
    for (const line of res.headers.getSetCookie()) {
      const [pair, ...attrs] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attrs.some((a) => /max-age=0/i.test(a) || /expires=thu, 01 jan 1970/i.test(a));
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    headers.set('x-forwarded-for', this.address);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    // Like a browser, every write names its origin; an empty Origin means "send none" (a mail client, a forged form).
    if (init.method && init.method !== 'GET' && !headers.has('origin')) headers.set('origin', this.base);
    if (headers.get('origin') === '') headers.delete('origin');
    const res = await fetchOnce(new URL(path, this.base), { ...init, headers, redirect: 'manual' });
    this.remember(res);
    return res;
  }

  async json<T = Record<string, unknown>>(
    method: string,
    path: string,
    body?: unknown,
    headers: Record<string, string> = {},
  ): Promise<JsonResponse<T>> {
    const res = await this.fetch(path, {
      method,
      headers: body === undefined ? headers : { 'content-type': 'application/json', ...headers },
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
    });
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // Not JSON: keep the text so the assertion shows it.
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  get<T = Record<string, unknown>>(path: string) {
    return this.json<T>('GET', path);
  }
  post<T = Record<string, unknown>>(path: string, body?: unknown) {
    return this.json<T>('POST', path, body);
  }
  put<T = Record<string, unknown>>(path: string, body?: unknown) {
    return this.json<T>('PUT', path, body);
  }
  patch<T = Record<string, unknown>>(path: string, body?: unknown) {
    return this.json<T>('PATCH', path, body);
  }
  delete<T = Record<string, unknown>>(path: string, body?: unknown) {
    return this.json<T>('DELETE', path, body);
  }

  private async csrfToken(): Promise<string> {
    const res = await this.get<{ csrfToken: string }>('/api/auth/csrf');
    return res.body.csrfToken;
  }

  /** Signs in through next-auth's credentials callback, as the sign-in page does. Returns true on success. */
  async signIn(email: string, password: string): Promise<boolean> {
    const csrfToken = await this.csrfToken();
    const res = await this.fetch('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email, password, csrfToken, json: 'true' }).toString(),
    });
    await res.text();
    return this.isSignedIn();
  }

  /** Asks for a magic link, as the sign-in page does. */
  async requestMagicLink(email: string): Promise<number> {
    const csrfToken = await this.csrfToken();
    const res = await this.fetch('/api/auth/signin/email', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email, csrfToken, json: 'true', callbackUrl: '/' }).toString(),
    });
    await res.text();
    return res.status;
  }

  async signOut(): Promise<void> {
    const csrfToken = await this.csrfToken();
    const res = await this.fetch('/api/auth/signout', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, json: 'true' }).toString(),
    });
    await res.text();
  }

  async isSignedIn(): Promise<boolean> {
    const me = await this.get<{ viewer: { id: string } | null }>('/api/me');
    return Boolean(me.body?.viewer);
  }

  async me(): Promise<{ id: string; role: string; handle: string } | null> {
    return (await this.get<{ viewer: { id: string; role: string; handle: string } | null }>('/api/me')).body.viewer;
  }
}
