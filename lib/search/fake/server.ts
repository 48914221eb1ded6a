/** HTTP front of the fake search engine, on a plain node:http server. */
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { badRequest, FakeApiError, invalidApiKey, missingAuthorization, notFound } from './errors';
import { FakeEngine } from './engine';

export interface FakeSearchServerOptions {
  /** 0 picks a free port. */
  port: number;
  host?: string;
  /** When set, every route except `/health` requires `Authorization: Bearer <apiKey>`. */
  apiKey?: string;
}

export interface FakeSearchServer {
  url: string;
  close(): Promise<void>;
}

const MAX_PAYLOAD_BYTES = 100 * 1024 * 1024;
const FAKE_VERSION = { commitSha: 'fake', commitDate: '1970-01-01T00:00:00Z', pkgVersion: '1.20.0' };

interface Call {
  params: URLSearchParams;
  body: () => unknown;
  match: string[];
}

interface Reply {
  status: number;
  body: unknown;
}

type Handler = (engine: FakeEngine, call: Call) => Reply;

const ok = (body: unknown): Reply => ({ status: 200, body });
const accepted = (body: unknown): Reply => ({ status: 202, body });

const segment = '([^/]+)';

/** GET search parameters arrive as strings; turn them into the POST body shape. */
function searchBodyFromQuery(params: URLSearchParams): Record<string, unknown> {
  const body: Record<string, unknown> = {};
  for (const [key, value] of params) {
    if (['offset', 'limit', 'page', 'hitsPerPage'].includes(key)) body[key] = value === '' ? undefined : Number(value);
    else if (['sort', 'facets', 'attributesToRetrieve', 'attributesToSearchOn'].includes(key))
      body[key] = value.split(',').filter(Boolean);
    else if (key === 'retrieveVectors') body[key] = value === 'true' ? true : value === 'false' ? false : value;
    else body[key] = value;
  }
  return body;
}

const ROUTES: Array<[string, RegExp, Handler]> = [
  ['GET', /^\/version$/, () => ok(FAKE_VERSION)],
  ['GET', /^\/stats$/, (engine) => ok(engine.stats())],
  ['GET', /^\/tasks$/, (engine, call) => ok(engine.tasks.list(call.params))],
  ['GET', /^\/tasks\/(\d+)$/, (engine, call) => ok(taskOrFail(engine, Number(call.match[0])))],
  ['GET', /^\/indexes$/, (engine, call) => ok(engine.listIndexes(call.params))],
  ['POST', /^\/indexes$/, (engine, call) => accepted(engine.createIndex(call.body()))],
  ['GET', new RegExp(`^/indexes/${segment}$`), (engine, call) => ok(engine.describeIndex(call.match[0]))],
  [
    'PATCH',
    new RegExp(`^/indexes/${segment}$`),
    (engine, call) => accepted(engine.updateIndex(call.match[0], call.body())),
  ],
  ['DELETE', new RegExp(`^/indexes/${segment}$`), (engine, call) => accepted(engine.deleteIndex(call.match[0]))],
  ['GET', new RegExp(`^/indexes/${segment}/stats$`), (engine, call) => ok(engine.indexStats(call.match[0]))],
  ['POST', new RegExp(`^/indexes/${segment}/search$`), (engine, call) => ok(engine.search(call.match[0], call.body()))],
  [
    'GET',
    new RegExp(`^/indexes/${segment}/search$`),
    (engine, call) => ok(engine.search(call.match[0], searchBodyFromQuery(call.params))),
  ],
  [
    'GET',
    new RegExp(`^/indexes/${segment}/documents$`),
    (engine, call) => ok(engine.listDocuments(call.match[0], call.params)),
  ],
  [
    'POST',
    new RegExp(`^/indexes/${segment}/documents$`),
    (engine, call) => accepted(engine.writeDocuments(call.match[0], call.body(), call.params, 'replace')),
  ],
  [
    'PUT',
    new RegExp(`^/indexes/${segment}/documents$`),
    (engine, call) => accepted(engine.writeDocuments(call.match[0], call.body(), call.params, 'merge')),
  ],
  [
    'DELETE',
    new RegExp(`^/indexes/${segment}/documents$`),
    (engine, call) => accepted(engine.deleteAllDocuments(call.match[0])),
  ],
  [
    'POST',
    new RegExp(`^/indexes/${segment}/documents/fetch$`),
    (engine, call) => ok(engine.fetchDocuments(call.match[0], call.body())),
  ],
  [
    'POST',
    new RegExp(`^/indexes/${segment}/documents/delete-batch$`),
    (engine, call) => accepted(engine.deleteDocumentBatch(call.match[0], call.body())),
  ],
  [
    'POST',
    new RegExp(`^/indexes/${segment}/documents/delete$`),
    (engine, call) => accepted(engine.deleteDocumentsByFilter(call.match[0], call.body())),
  ],
  [
    'GET',
    new RegExp(`^/indexes/${segment}/documents/${segment}$`),
    (engine, call) => ok(engine.getDocument(call.match[0], call.match[1], call.params)),
  ],
  [
    'DELETE',
    new RegExp(`^/indexes/${segment}/documents/${segment}$`),
    (engine, call) => accepted(engine.deleteDocument(call.match[0], call.match[1])),
  ],
  ['GET', new RegExp(`^/indexes/${segment}/settings$`), (engine, call) => ok(engine.getSettings(call.match[0]))],
  [
    'PATCH',
    new RegExp(`^/indexes/${segment}/settings$`),
    (engine, call) => accepted(engine.updateSettings(call.match[0], call.body())),
  ],
  [
    'DELETE',
    new RegExp(`^/indexes/${segment}/settings$`),
    (engine, call) => accepted(engine.resetSettings(call.match[0])),
  ],
  [
    'GET',
    new RegExp(`^/indexes/${segment}/settings/${segment}$`),
    (engine, call) => ok(engine.getSetting(call.match[0], call.match[1])),
  ],
  [
    'PUT',
    new RegExp(`^/indexes/${segment}/settings/${segment}$`),
    (engine, call) => accepted(engine.updateSetting(call.match[0], call.match[1], call.body())),
  ],
  [
    'PATCH',
    new RegExp(`^/indexes/${segment}/settings/${segment}$`),
    (engine, call) => accepted(engine.updateSetting(call.match[0], call.match[1], call.body())),
  ],
  [
    'DELETE',
    new RegExp(`^/indexes/${segment}/settings/${segment}$`),
    (engine, call) => accepted(engine.resetSetting(call.match[0], call.match[1])),
  ],
];

function taskOrFail(engine: FakeEngine, uid: number) {
  const task = engine.tasks.get(uid);
  if (!task) throw new FakeApiError(404, 'task_not_found', `Task \`${uid}\` not found.`);
  return task;
}

function checkAuthorization(request: IncomingMessage, apiKey: string | undefined): void {
  if (!apiKey) return;
  const header = request.headers.authorization;
  if (!header) throw missingAuthorization();
  if (header !== `Bearer ${apiKey}`) throw invalidApiKey();
}

function readBody(request: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    request.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_PAYLOAD_BYTES) {
        reject(
          new FakeApiError(
            413,
            'payload_too_large',
            `The provided payload reached the size limit of ${MAX_PAYLOAD_BYTES} bytes.`,
          ),
        );
        request.destroy();
      } else {
        chunks.push(chunk);
      }
    });
    request.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    request.on('error', reject);
  });
}

function parseJson(text: string): unknown {
  if (text.trim() === '') throw badRequest('missing_payload', 'A json payload is missing.');
  try {
    return JSON.parse(text);
  } catch (error) {
    throw badRequest('malformed_payload', `The json payload provided is malformed. \`${(error as Error).message}\`.`);
  }
}

function send(response: ServerResponse, reply: Reply): void {
  const payload = JSON.stringify(reply.body);
  response.writeHead(reply.status, {
    'Content-Type': 'application/json',
    'Content-Length': Buffer.byteLength(payload),
  });
  response.end(payload);
}

async function handle(engine: FakeEngine, apiKey: string | undefined, request: IncomingMessage): Promise<Reply> {
  const url = new URL(request.url ?? '/', 'http://fake.local');
  const path = url.pathname.replace(/\/+$/, '') || '/';
  const method = request.method ?? 'GET';
  if (method === 'GET' && path === '/health') return ok({ status: 'available' });
  checkAuthorization(request, apiKey);
  const text = await readBody(request);
  for (const [routeMethod, pattern, handler] of ROUTES) {
    const match = routeMethod === method ? pattern.exec(path) : null;
    if (match) {
      return handler(engine, {
        params: url.searchParams,
        body: () => parseJson(text),
        match: match.slice(1).map(decodeSegment),
      });
    }
  }
  throw notFound();
}

function decodeSegment(segmentText: string): string {
  try {
    return decodeURIComponent(segmentText);
  } catch {
    throw badRequest('bad_request', `The path segment \`${segmentText}\` is not valid percent-encoding.`);
  }
}

function toReply(error: unknown): Reply {
  const apiError =
    error instanceof FakeApiError
      ? error
      : new FakeApiError(500, 'internal', 'An internal error occurred in the search fake.', 'internal');
  if (!(error instanceof FakeApiError)) console.error(error);
  return { status: apiError.status, body: apiError.toBody() };
}

/** Starts the fake on `host:port` (default host 127.0.0.1) and resolves once it listens. */
export function createFakeSearchServer(options: FakeSearchServerOptions): Promise<FakeSearchServer> {
  const engine = new FakeEngine();
  const server = createServer((request, response) => {
    handle(engine, options.apiKey, request).then(
      (reply) => send(response, reply),
      (error: unknown) => send(response, toReply(error)),
    );
  });
  server.keepAliveTimeout = 60_000;
  const host = options.host ?? '127.0.0.1';
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, host, () => {
      const { port } = server.address() as AddressInfo;
      resolve({
        url: `http://${host}:${port}`,
        close: () =>
          new Promise<void>((done, fail) => {
            engine.tasks.close();
            server.close((error) => (error ? fail(error) : done()));
            server.closeAllConnections();
          }),
      });
    });
  });
}
