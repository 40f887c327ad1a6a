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
  const text = await req.text();
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

function isDatabaseDown(err: unknown): boolean {
  const name = (err as { name?: string })?.name ?? '';
  const code = (err as { parent?: { code?: string }; original?: { code?: string } })?.parent?.code;
  return (
    /^Sequelize(Connection\w*|HostNotReachable|HostNotFound|AccessDenied|InvalidConnection)Error$/.test(
      name,
    ) ||
    code === 'ECONNREFUSED' ||
    code === '57P01' ||
    code === '57P03' ||
    /Connection terminated|ECONNREFUSED|timeout exceeded when trying to connect/i.test(
      String((err as Error)?.message ?? ''),
    )
  );
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
  if (isDatabaseDown(err)) {
    return Response.json(
      { error: 'The database is not reachable just now. Nothing was changed; try again shortly.' },
      { status: 503, headers: { 'Retry-After': '5' } },
    );
  }
  console.error('[api] unexpected error', err);
  return Response.json({ error: 'Something went wrong on our side.' }, { status: 500 });
}
