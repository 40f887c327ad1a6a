import { ZodError, type z } from 'zod';

import type { Action } from '@/lib/auth/permissions';
import { requireActor, type Actor } from '@/lib/auth/session';
import type { Role } from '@/lib/domain';
import { badRequest, HttpError, SOCKET_AWAY_CODES, type FieldIssue } from '@/lib/errors';

/** Largest JSON body any route accepts. */
export const MAX_BODY_BYTES = 2 * 1024 * 1024;

/** Turns zod issues into one `{ path, message }` per bad field (`root`: the issue about the whole). */
export function fieldIssues(error: ZodError, root = '(body)'): FieldIssue[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.') || root,
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

/** Validates the query string (each name once); junk becomes a 400 naming each bad field. */
export function parseQuery<S extends z.ZodType>(url: string, schema: S): z.infer<S> {
  const parsed = schema.safeParse(Object.fromEntries(new URL(url).searchParams));
  if (!parsed.success) throw badRequest(fieldIssues(parsed.error, '(query)'));
  return parsed.data;
}

// Error codes of a database that is away: node socket errors, and PostgreSQL's connection
// exceptions (class 08), shutdown and start-up (57P01-57P03).
const DOWN_CODES = new Set<string>([
  ...SOCKET_AWAY_CODES,
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
    /^Sequelize(Connection\w*|HostNotReachable|HostNotFound|AccessDenied|InvalidConnection)Error$/.test(e.name ?? '') ||
    codes.some((c) => DOWN_CODES.has(c)) ||
    /Connection terminated|timeout exceeded when trying to connect|not queryable/i.test(String(e.message ?? ''))
  ) {
    return 'down';
  }
  return null;
}

/** Who may call a route: a permission of lib/auth/permissions.ts, any signed-in member, or anybody. */
export type RouteAccess = Action | 'signed-in' | 'public';

/**
 * Where a route meets the organisation boundary:
 * - `path`: the params name an object; another organisation's is 404 (the default with `params`);
 * - `body`: the body names an object (a site for a new board); another organisation's is 404;
 * - `list`: the answer lists or shows the caller's organisation only;
 * - `none`: no organisation data (the caller's own identity, pure sizing, public routes).
 */
export type RouteScope = 'path' | 'body' | 'list' | 'none';

/** What a route states about itself once: the wrapper enforces it, and the tests read it. */
export type RouteDeclaration = {
  /** The permission checked before anything else is read (after the params). */
  action: RouteAccess;
  /** Why a public route is public (required with `action: 'public'`). */
  publicBecause?: string;
  /** The DAL lets fewer roles through than `action` does, and where it says so. */
  narrowedTo?: { roles: readonly Role[]; by: string };
  /** The path params; junk is a 404. */
  params?: z.ZodType;
  /** The query string (each name once); junk is a 400 naming the field. */
  query?: z.ZodType;
  /** The JSON body (junk is a 400 naming each field), or a form the handler reads itself. */
  body?: z.ZodType | 'multipart';
  scope: RouteScope;
};

type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;

/** What a declared route's handler gets: everything already checked and parsed. */
export type RouteInput<A extends RouteAccess, P, Q, B> = {
  req: Request;
  /** Who calls (null on a public route). */
  actor: A extends 'public' ? null : Actor;
  params: Parsed<P>;
  query: Parsed<Q>;
  body: Parsed<B>;
};

/** A Next route handler that carries its declaration. */
export type DeclaredRoute = ((req: Request, ctx: { params: Promise<unknown> }) => Promise<Response>) & {
  declaration: RouteDeclaration;
};

/** Attaches a declaration to a handler made elsewhere (next-auth's own); checks it is complete. */
export function declareRoute<F extends (...args: never[]) => Promise<Response>>(
  handler: F,
  declaration: RouteDeclaration,
): F & { declaration: RouteDeclaration } {
  if (declaration.action === 'public' && !declaration.publicBecause) {
    throw new Error('A public route says why it is public (publicBecause).');
  }
  return Object.assign(handler, { declaration: Object.freeze({ ...declaration }) });
}

/**
 * A route handler with its declaration: `action`, `params`, `query` and `body` are stated
 * once, and the wrapper runs them in order (params → session and role → query → body), then
 * the handler; every failure becomes its status code (see `errorResponse`). `scope` defaults
 * to `path` when the route has params, and must be given otherwise.
 */
export function defineRoute<
  const A extends RouteAccess,
  P extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  B extends z.ZodType | 'multipart' | undefined = undefined,
>(
  spec: Omit<RouteDeclaration, 'action' | 'params' | 'query' | 'body' | 'scope'> & {
    action: A;
    params?: P;
    query?: Q;
    body?: B;
    scope?: RouteScope;
    handler: (input: RouteInput<A, P, Q, B>) => Promise<Response>;
  },
): DeclaredRoute {
  const { handler, ...declared } = spec;
  const scope = declared.scope ?? (declared.params ? 'path' : undefined);
  if (!scope) throw new Error('A route without params states its scope.');
  const run = async (req: Request, ctx: { params: Promise<unknown> }): Promise<Response> => {
    try {
      // Params: a junk id is a 404 before anything else is read
      const params = declared.params ? parseParams((await ctx?.params) ?? {}, declared.params) : undefined;
      // Session and role
      const actor =
        declared.action === 'public'
          ? null
          : await requireActor(declared.action === 'signed-in' ? undefined : declared.action);
      // Query and body
      const query = declared.query ? parseQuery(req.url, declared.query) : undefined;
      const body = declared.body && declared.body !== 'multipart' ? await parseBody(req, declared.body) : undefined;
      return await handler({ req, actor, params, query, body } as RouteInput<A, P, Q, B>);
    } catch (err) {
      return errorResponse(err);
    }
  };
  return declareRoute(run, { ...declared, scope });
}

/** The JSON error answer for anything a handler or server action throws. */
export function errorResponse(err: unknown): Response {
  if (err instanceof HttpError) {
    // A refusal that can pass (e.g. the print queue full) says when to try again
    const retry = typeof err.body.retryAfter === 'number' ? { 'Retry-After': String(err.body.retryAfter) } : undefined;
    return Response.json({ error: err.message, ...err.body }, { status: err.status, headers: retry });
  }
  if (err instanceof ZodError) {
    return Response.json({ error: 'Some fields are not valid.', issues: fieldIssues(err) }, { status: 400 });
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
