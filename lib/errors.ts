/** A failure the API reports to the caller with a status code and a plain message. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly body: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

export type FieldIssue = { path: string; message: string };

export const unauthorized = () => new HttpError(401, 'Sign in to continue.');
export const forbidden = (what = 'do this') => new HttpError(403, `Your role may not ${what}.`);
export const notFound = (what = 'That item') => new HttpError(404, `${what} was not found.`);
export const conflict = (message: string, body: Record<string, unknown> = {}) => new HttpError(409, message, body);
export const badRequest = (issues: FieldIssue[], message = 'Some fields are not valid.') =>
  new HttpError(400, message, { issues });
export const unprocessable = (message: string, body: Record<string, unknown> = {}) => new HttpError(422, message, body);

/** Node's socket errors of a service that is away (nothing answered): the database, file storage. */
export const SOCKET_AWAY_CODES = [
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
] as const;
