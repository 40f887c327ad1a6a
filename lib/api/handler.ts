import { ZodError, type z } from 'zod';

import { badRequest, HttpError, type FieldIssue } from '@/lib/errors';

type RouteContext<P> = { params: Promise<P> };
type Handler<P> = (req: Request, params: P) => Promise<Response>;

/** Largest JSON body any route accepts. */
export const MAX_BODY_BYTES = 2 * 1024 * 1024;

/** Turns zod issues into one `{ path, message }` per bad field. */
export function fieldIssues(error: ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.') || '(body)',
    message: issue.message,
  }));
}

/** Parses a JSON body against a schema; junk becomes a 400 naming each bad field. */
export async function parseBody<S extends z.ZodType>(req: Request, schema: S): Promise<z.infer<S>> {
  // An empty body is not read (reading the stream costs more than a small route's work)
  const text = req.headers.get('content-length') === '0' ? '' : await req.text();
  if (text.length > MAX_BODY_BYTES) {
    throw new HttpError(413, `The request body is larger than ${MAX_BODY_BYTES / 1024 / 1024} MB.`);
  }
  let json: unknown;
  try {
    json = text.length ? JSON.parse(text) : undefined;
  } catch {
    throw badRequest([{ path: '(body)', message: 'The body is not valid JSON.' }]);
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) throw badRequest(fieldIssues(parsed.error));
  return parsed.data;
}

/** Validates route params (ids) the same way as bodies, so a junk id is a 404, not a crash. */
export function parseParams<S extends z.ZodType>(params: unknown, schema: S): z.infer<S> {
  const parsed = schema.safeParse(params);
  if (!parsed.success) throw new HttpError(404, 'That item was not found.');
  return parsed.data;
}

// Error codes of a database that is away: node socket errors, and PostgreSQL's connection
// exceptions (class 08), shutdown and start-up (57P01-57P03).
const DOWN_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  '57P01',
  '57P02',
  '57P03',
  '08000',
  '08001',
  '08003',
  '08004',
  '08006',
]);
// A database that is there but cannot serve just now: a statement cut by statement_timeout
// (57014), too many connections (53300). The transaction was rolled back either way.
const BUSY_CODES = new Set(['57014', '53300']);

/**
 * Whether a failure means the database is away ('down') or overloaded ('busy'), from what
 * Sequelize and pg actually throw: Sequelize's connection errors (refused, host, access,
 * acquire timeout), a SequelizeDatabaseError whose `parent` carries the PostgreSQL code, or
 * pg's own "Connection terminated" errors.
 */
function databaseTrouble(err: unknown): 'down' | 'busy' | null {
  const e = err as {
    name?: string;
    code?: string;
    message?: string;
    parent?: { code?: string };
    original?: { code?: string };
  } | null;
  if (!e || typeof e !== 'object') return null;
  // Codes only from the database layer: an S3 or SMTP socket error is not the database
  const fromSequelize = (e.name ?? '').startsWith('Sequelize');
  const fromPg = 'severity' in e;
  const codes = [
    fromPg ? e.code : undefined,
    fromSequelize ? e.parent?.code : undefined,
    fromSequelize ? e.original?.code : undefined,
  ].filter((c): c is string => !!c);
  if (codes.some((c) => BUSY_CODES.has(c))) return 'busy';
  if (
    /^Sequelize(Connection\w*|HostNotReachable|HostNotFound|AccessDenied|InvalidConnection)Error$/.test(
      e.name ?? '',
    ) ||
    codes.some((c) => DOWN_CODES.has(c)) ||
    /Connection terminated|timeout exceeded when trying to connect|not queryable/i.test(
      String(e.message ?? ''),
    )
  ) {
    return 'down';
  }
  return null;
}

/**
 * Wraps a route handler: awaits its params and maps every failure to a status code
 * (401, 403, 404, 409, 400/422 with field issues, 503 when the database is away, 500).
 */
export function route<P = Record<string, never>>(handler: Handler<P>) {
  return async (req: Request, ctx: RouteContext<P>): Promise<Response> => {
    try {
      const params = ctx?.params ? await ctx.params : ({} as P);
      return await handler(req, params);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

/** The JSON error answer for anything a handler or server action throws. */
export function errorResponse(err: unknown): Response {
  if (err instanceof HttpError) {
    return Response.json({ error: err.message, ...err.body }, { status: err.status });
  }
  if (err instanceof ZodError) {
    return Response.json(
      { error: 'Some fields are not valid.', issues: fieldIssues(err) },
      { status: 400 },
    );
  }
  const trouble = databaseTrouble(err);
  if (trouble) {
    const error =
      trouble === 'down'
        ? 'The database is not reachable just now. Nothing was changed; try again shortly.'
        : 'The database is too busy just now. Nothing was changed; try again shortly.';
    return Response.json({ error }, { status: 503, headers: { 'Retry-After': '5' } });
  }
  console.error('[api] unexpected error', err);
  return Response.json({ error: 'Something went wrong on our side.' }, { status: 500 });
}
