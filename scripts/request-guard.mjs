// What scripts/serve.mjs does to every request before Next.js sees it.

/**
 * The connecting socket's address, set here and nowhere else. The app keys its per-address limits
 * on it (lib/rate-limit.ts); a copy sent by the client is removed first, so it cannot be forged.
 */
export const CLIENT_ADDRESS_HEADER = 'x-kettlefork-client-address';

/** The socket's address in its plain form (an IPv4 client on a dual-stack socket shows as ::ffff:a.b.c.d). */
function socketAddress(req) {
  const address = req.socket?.remoteAddress ?? '';
  return address.startsWith('::ffff:') && address.includes('.') ? address.slice(7) : address;
}

/** True when the path (not the query) is valid percent-encoding of UTF-8 (RFC 3986, section 2.1; RFC 3629). */
function pathDecodes(url) {
  const end = url.search(/[?#]/);
  try {
    decodeURIComponent(end === -1 ? url : url.slice(0, end));
    return true;
  } catch {
    return false;
  }
}

/**
 * Readies one request for the app: answers a path that does not decode with a plain 400 (Next.js
 * would fail on it with a 500 before any of our code runs) and stamps the client's socket address.
 * Returns false when it has answered the request itself.
 */
export function guardRequest(req, res) {
  if (!pathDecodes(req.url ?? '/')) {
    res.writeHead(400, {
      'content-type': 'text/plain; charset=utf-8',
      'x-content-type-options': 'nosniff',
      'cache-control': 'no-store',
    });
    res.end('Bad request: the address has broken percent-encoding (a % must be followed by UTF-8 bytes in hex).\n');
    return false;
  }
  // Node folds repeated headers into one value; rawHeaders keeps each copy, so both are cleaned.
  const raw = [];
  for (let i = 0; i < req.rawHeaders.length; i += 2) {
    if (req.rawHeaders[i].toLowerCase() !== CLIENT_ADDRESS_HEADER) raw.push(req.rawHeaders[i], req.rawHeaders[i + 1]);
  }
  const address = socketAddress(req);
  raw.push(CLIENT_ADDRESS_HEADER, address);
  req.rawHeaders = raw;
  req.headers[CLIENT_ADDRESS_HEADER] = address;
  return true;
}

/**
 * The global that lib/page-cache.ts sets once the app has started (instrumentation.ts): given Node's
 * request, a promise of the whole answer for a kept recipe page, or of null for anything else.
 */
const KEPT_PAGE_HOOK = '__kettleforkKeptPage';

/**
 * Answers a kept recipe page from memory without Next.js routing it (its router, proxy and response
 * streams cost several times the copy itself); anything else, or any failure, goes on to the app,
 * whose proxy.ts gives the same answers.
 */
function answerKeptPage(req, res, handler) {
  const kept = globalThis[KEPT_PAGE_HOOK];
  if (typeof kept !== 'function' || req.method !== 'GET' || !req.url?.startsWith('/recipes/')) {
    return handler(req, res);
  }
  kept(req)
    .catch(() => null)
    .then((answer) => {
      if (!answer) return handler(req, res);
      res.writeHead(answer.status, answer.headers);
      res.end(answer.body ?? undefined);
    })
    .catch(() => {
      if (res.headersSent) res.destroy();
      else handler(req, res);
    });
}

/**
 * Makes every HTTP server created from now on in this process run guardRequest before its own
 * handler (and answer kept recipe pages itself), and tells the app (lib/rate-limit.ts) that the
 * address header can be believed.
 */
export function guardServers(http) {
  process.env.KF_SOCKET_ADDRESS_HEADER = '1';
  const createServer = http.createServer;
  http.createServer = function createGuardedServer(...args) {
    const last = args.length - 1;
    if (typeof args[last] === 'function') {
      const handler = args[last];
      args[last] = (req, res) => {
        if (guardRequest(req, res)) return answerKeptPage(req, res, handler);
      };
    }
    return createServer.apply(this, args);
  };
}
