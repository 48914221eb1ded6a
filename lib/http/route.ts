import 'server-only';
import { NextResponse, type NextRequest } from 'next/server';
import type { z } from 'zod';
import { AppError, invalidInput } from '@/lib/errors';
import { getViewer, type Viewer } from '@/lib/auth/session';
import { hasRole, type Role } from '@/lib/auth/roles';
import { isDatabaseUnavailable, loggableError } from '@/lib/db-errors';
import { assertStorableText } from '@/lib/validation/text';
import { readBodyWithin } from './body';
import { crossSiteReason } from './origin';

type Access = 'public' | 'user' | Role;

interface RouteOptions<
  A extends Access,
  B extends z.ZodType | undefined,
  Q extends z.ZodType | undefined,
  P extends z.ZodType | undefined,
> {
  access: A;
  body?: B;
  /** Schema for the query string (each key's first value). */
  query?: Q;
  /**
   * Schema for the path's [segments], e.g. `z.object({ id: idSchema })`. A path that does not
   * parse names nothing, so it is a 404, before the session is loaded or any query runs.
   */
  params?: P;
  /** Largest accepted body in bytes; checked before the body is read. */
  maxBodyBytes?: number;
}

interface RouteContext<B, P, Q = unknown> {
  req: NextRequest;
  body: B;
  query: Q;
  params: P;
  viewer: Viewer | null;
}

type UserContext<B, P, Q> = RouteContext<B, P, Q> & { viewer: Viewer };

type Handler<B, P, Q, A extends Access> = (
  ctx: A extends 'public' ? RouteContext<B, P, Q> : UserContext<B, P, Q>,
) => Promise<unknown> | unknown;

type Parsed<S> = S extends z.ZodType ? z.infer<S> : undefined;
/** Without a params schema a handler gets no path parameters to use unchecked. */
type ParsedParams<S> = S extends z.ZodType ? z.infer<S> : Record<string, never>;

const MUTATING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * Builds a route handler: parses the path's parameters, checks the origin of state-changing
 * requests, loads the session, enforces the access level, parses the JSON body and the query with
 * zod and maps errors to plain JSON. Ownership is checked inside the handler, next to the query
 * that loads the row.
 */
export function route<
  A extends Access,
  B extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  P extends z.ZodType | undefined = undefined,
>(options: RouteOptions<A, B, Q, P>, handler: Handler<Parsed<B>, ParsedParams<P>, Parsed<Q>, A>) {
  return async (req: NextRequest, context: { params: Promise<Record<string, string | string[]>> }) => {
    const requestId = crypto.randomUUID();
    try {
      const params = options.params ? await parseParams(context, options.params) : {};
      if (MUTATING.has(req.method)) assertSameOrigin(req);
      const viewer = await getViewer();
      if (options.access !== 'public') {
        if (!viewer) throw new AppError('unauthenticated');
        if (options.access !== 'user' && !hasRole(viewer, options.access)) {
          throw new AppError('forbidden', 'resource', 'Your role does not allow this.');
        }
      }
      const body = options.body
        ? await parseJsonBody(req, options.body, options.maxBodyBytes ?? 512 * 1024)
        : undefined;
      const query = options.query ? parseQuery(req, options.query) : undefined;
      const result = await handler({ req, body, query, params, viewer } as never);
      if (result instanceof Response) return result;
      return NextResponse.json(result ?? { ok: true }, { status: req.method === 'POST' ? 201 : 200 });
    } catch (err) {
      const res = errorResponse(err, requestId);
      if (err instanceof BodyCutOff) res.headers.set('Connection', 'close');
      return res;
    }
  };
}

export function errorResponse(err: unknown, requestId: string = crypto.randomUUID()): NextResponse {
  if (err instanceof AppError) {
    return NextResponse.json(
      { error: { code: err.code, message: err.message, fields: err.fields, details: err.details, requestId } },
      // Whatever is briefly unavailable (a store, a busy worker pool) says when to come back.
      { status: err.status, headers: err.status === 503 ? { 'Retry-After': '5' } : undefined },
    );
  }
  if (isDatabaseUnavailable(err)) {
    console.error(`[${requestId}] database unavailable:`, loggableError(err).split('\n')[0]);
    return NextResponse.json(
      {
        error: {
          code: 'unavailable',
          message: 'Kettlefork is briefly unavailable; please try again in a moment.',
          requestId,
        },
      },
      { status: 503, headers: { 'Retry-After': '5' } },
    );
  }
  console.error(`[${requestId}]`, loggableError(err));
  return NextResponse.json(
    { error: { code: 'internal', message: 'Something went wrong on our side. Please try again.', requestId } },
    { status: 500 },
  );
}

/** A body cut off mid-stream leaves the connection unusable; its refusal closes it. */
class BodyCutOff extends AppError {}

async function parseJsonBody<S extends z.ZodType>(req: NextRequest, schema: S, maxBytes: number): Promise<z.infer<S>> {
  const message = `The request body is larger than ${maxBytes} bytes.`;
  const declared = Number(req.headers.get('content-length') ?? '0');
  if (declared > maxBytes) throw new AppError('too_large', 'request body', message);
  const bytes = await readBodyWithin(req.body, maxBytes);
  if (!bytes) throw new BodyCutOff('too_large', 'request body', message);
  const text = bytes.toString('utf8');
  let json: unknown;
  try {
    json = text.length ? JSON.parse(text) : undefined;
  } catch {
    throw new AppError('bad_request', 'request body', 'The request body is not valid JSON.');
  }
  assertStorableText(json);
  const parsed = schema.safeParse(json);
  if (!parsed.success) throw invalidInput(parsed.error);
  return parsed.data;
}

async function parseParams<S extends z.ZodType>(
  context: { params?: Promise<Record<string, string | string[]>> },
  schema: S,
): Promise<z.infer<S>> {
  const parsed = schema.safeParse((await context?.params) ?? {});
  if (!parsed.success) throw new AppError('not_found', 'page', parsed.error.issues[0]?.message ?? 'No such page.');
  return parsed.data;
}

function parseQuery<S extends z.ZodType>(req: NextRequest, schema: S): z.infer<S> {
  const raw = Object.fromEntries(req.nextUrl.searchParams);
  assertStorableText(raw, 'query');
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw invalidInput(parsed.error, 'query');
  return parsed.data;
}

// State changes must come from our own pages (a cross-site form or fetch is refused).
function assertSameOrigin(req: NextRequest): void {
  const reason = crossSiteReason(req.headers, { trustProxy: process.env.TRUST_PROXY === '1' });
  if (reason) throw new AppError('forbidden', 'request', `Cross-site request refused: ${reason}.`);
}
