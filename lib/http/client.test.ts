import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, requestJson, sendJson, uploadForm } from './client';

/** Answers every fetch with this status and body, and keeps what was sent. */
function answer(status: number, body: string, contentType = 'application/json') {
  const sent: { url: string; init: RequestInit }[] = [];
  vi.stubGlobal('fetch', async (url: string, init: RequestInit) => {
    sent.push({ url, init });
    return new Response(status === 204 ? null : body, { status, headers: { 'content-type': contentType } });
  });
  return sent;
}

afterEach(() => vi.unstubAllGlobals());

describe('requestJson', () => {
  it('sends a JSON body and returns the parsed answer', async () => {
    const sent = answer(201, '{"id":"b1"}');
    const result = await requestJson<{ id: string }>('/api/brew-days', 'POST', { notes: 'Mash in at 67 °C' });
    expect(result).toEqual({ ok: true, status: 201, data: { id: 'b1' } });
    expect(sent[0].init.method).toBe('POST');
    expect(sent[0].init.body).toBe('{"notes":"Mash in at 67 °C"}');
    expect(new Headers(sent[0].init.headers).get('content-type')).toBe('application/json');
  });

  it('sends no body and no content type when there is nothing to send', async () => {
    const sent = answer(200, '{"ok":true}');
    await requestJson('/api/photos/p1', 'DELETE');
    expect(sent[0].init.body).toBeUndefined();
    expect(new Headers(sent[0].init.headers).has('content-type')).toBe(false);
  });

  it("keeps a refusal's code, message and every field", async () => {
    answer(
      400,
      JSON.stringify({
        error: {
          code: 'bad_request',
          message: 'Please check these fields: title: Give your fork a title.',
          fields: [
            { path: 'title', message: 'Give your fork a title.' },
            { path: 'visibility', message: 'Visibility must be public, unlisted or private.' },
          ],
          requestId: 'r1',
        },
      }),
    );
    const result = await requestJson('/api/versions/v1/fork', 'POST', { title: '' });
    expect(result).toEqual({
      ok: false,
      status: 400,
      code: 'bad_request',
      message: 'Please check these fields: title: Give your fork a title.',
      fields: [
        { path: 'title', message: 'Give your fork a title.' },
        { path: 'visibility', message: 'Visibility must be public, unlisted or private.' },
      ],
      details: undefined,
    });
  });

  it("keeps a 409's details, the head a refused save names", async () => {
    const head = { id: 'v2', number: 2, message: 'Hotter mash', authorName: 'Ada Brewer' };
    answer(
      409,
      JSON.stringify({ error: { code: 'conflict', message: 'The recipe changed meanwhile.', details: { head } } }),
    );
    const result = await requestJson('/api/recipes/r1/versions', 'POST', {});
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.status).toBe(409);
    expect(result.code).toBe('conflict');
    expect(result.details).toEqual({ head });
  });

  it("answers a proxy's HTML page with plain words for its status", async () => {
    answer(502, '<html><body>Bad gateway</body></html>', 'text/html');
    const result = await requestJson('/api/me/settings', 'PUT', {});
    expect(result).toMatchObject({ ok: false, status: 502, code: 'http', fields: [] });
    if (!result.ok) expect(result.message).toBe('Kettlefork could not answer just now; please try again in a moment.');
  });

  it('leaves out field entries that are not a path and a message', async () => {
    answer(
      400,
      JSON.stringify({
        error: { message: 'No.', fields: [{ path: 'body' }, 'text', { path: 'body', message: 'Write your comment.' }] },
      }),
    );
    const result = await requestJson('/api/comments/c1', 'PATCH', { body: '' });
    expect(result.ok ? [] : result.fields).toEqual([{ path: 'body', message: 'Write your comment.' }]);
  });

  it('turns a lost connection into a message people can act on', async () => {
    vi.stubGlobal('fetch', async () => {
      throw new TypeError('Failed to fetch');
    });
    expect(await requestJson('/api/recipes', 'POST', {})).toEqual({
      ok: false,
      status: 0,
      code: 'network',
      message: 'Kettlefork could not be reached. Check your connection and try again.',
      fields: [],
      details: undefined,
    });
  });

  it('still throws when the caller aborted, so a query can be cancelled', async () => {
    const controller = new AbortController();
    controller.abort();
    vi.stubGlobal('fetch', async () => {
      throw new DOMException('The operation was aborted.', 'AbortError');
    });
    await expect(requestJson('/api/search?q=pale', 'GET', undefined, { signal: controller.signal })).rejects.toThrow(
      'aborted',
    );
  });
});

describe('sendJson', () => {
  it('returns the data of an answer', async () => {
    answer(200, '{"starred":true,"starCount":4}');
    expect(await sendJson('/api/recipes/r1/star', 'POST')).toEqual({ starred: true, starCount: 4 });
  });

  it("throws an ApiError saying the first field's message, and keeps the whole refusal", async () => {
    answer(
      400,
      JSON.stringify({
        error: {
          code: 'bad_request',
          message: 'Please check these fields.',
          fields: [{ path: 'reason', message: 'Say why.' }],
        },
      }),
    );
    const error = await sendJson('/api/reports', 'POST', {}).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      message: 'Say why.',
      summary: 'Please check these fields.',
      status: 400,
      code: 'bad_request',
      fields: [{ path: 'reason', message: 'Say why.' }],
    });
  });
});

/** A stand-in for the browser's XMLHttpRequest that answers as told once the body is "sent". */
function fakeXhr(outcome: { status: number; body: string } | 'network') {
  const made: FakeXhr[] = [];
  class FakeXhr {
    method = '';
    url = '';
    headers: Record<string, string> = {};
    sentBody: unknown;
    status = 0;
    responseText = '';
    upload: {
      onprogress?: (e: { lengthComputable: boolean; loaded: number; total: number }) => void;
      onload?: () => void;
    } = {};
    onload?: () => void;
    onerror?: () => void;
    onabort?: () => void;
    constructor() {
      made.push(this);
    }
    open(method: string, url: string) {
      this.method = method;
      this.url = url;
    }
    setRequestHeader(name: string, value: string) {
      this.headers[name] = value;
    }
    send(body: unknown) {
      this.sentBody = body;
      queueMicrotask(() => {
        this.upload.onprogress?.({ lengthComputable: true, loaded: 50, total: 200 });
        this.upload.onprogress?.({ lengthComputable: true, loaded: 200, total: 200 });
        this.upload.onload?.();
        if (outcome === 'network') return this.onerror?.();
        this.status = outcome.status;
        this.responseText = outcome.body;
        this.onload?.();
      });
    }
  }
  vi.stubGlobal('XMLHttpRequest', FakeXhr);
  return made;
}

describe('uploadForm', () => {
  it('posts the form as it is, reports progress, then the server starting work, and returns the answer', async () => {
    const made = fakeXhr({ status: 201, body: '{"id":"p1"}' });
    const form = new FormData();
    form.append('caption', 'Mash in');
    const progress: Array<number | 'sent'> = [];
    const result = await uploadForm('/api/brew-days/b1/photos', form, {
      onProgress: (percent) => progress.push(percent),
      onSent: () => progress.push('sent'),
    });
    expect(result).toEqual({ ok: true, status: 201, data: { id: 'p1' } });
    expect(made[0]).toMatchObject({ method: 'POST', url: '/api/brew-days/b1/photos' });
    expect(made[0].sentBody).toBe(form);
    expect(progress).toEqual([25, 100, 'sent']);
  });

  it("reads a refused upload's message as requestJson does", async () => {
    fakeXhr({
      status: 413,
      body: JSON.stringify({ error: { code: 'too_large', message: 'The photo is larger than 10 MB.' } }),
    });
    const result = await uploadForm('/api/brew-days/b1/photos', new FormData());
    expect(result).toMatchObject({
      ok: false,
      status: 413,
      code: 'too_large',
      message: 'The photo is larger than 10 MB.',
    });
  });

  it('turns a dropped upload into the network failure', async () => {
    fakeXhr('network');
    const result = await uploadForm('/api/brew-days/b1/photos', new FormData());
    expect(result).toMatchObject({ ok: false, status: 0, code: 'network' });
  });
});
