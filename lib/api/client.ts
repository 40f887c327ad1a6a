/** One bad field as the API reports it: a dotted path (`supply.uoV`) and a message. */
export type ApiFieldIssue = { path: string; message: string };

/**
 * A failed API call: its HTTP status (0 when unreachable), message and field issues, and the
 * whole error body for routes that say more (a save's stored version, a refusal's failing ways).
 */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues: ApiFieldIssue[] = [],
    readonly body: unknown = undefined,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

const fallbackMessages: Record<number, string> = {
  400: 'Some fields are not valid.',
  401: 'Your session has ended. Sign in again.',
  403: 'Your role may not do this.',
  404: 'That item was not found.',
  409: 'Someone else changed this first. Reload and try again.',
  410: 'This link has been used or has expired.',
  413: 'The request is too large.',
  503: 'The service is not reachable just now. Nothing was changed; try again shortly.',
};

function isIssueList(value: unknown): value is ApiFieldIssue[] {
  return (
    Array.isArray(value) &&
    value.every(
      (i) =>
        typeof i === 'object' &&
        i !== null &&
        typeof (i as ApiFieldIssue).path === 'string' &&
        typeof (i as ApiFieldIssue).message === 'string',
    )
  );
}

/**
 * Calls one of the app's JSON routes. A plain object `body` is sent as JSON. Resolves with the
 * parsed JSON (or `undefined` for 204); rejects with an `ApiError` for any failure, including a
 * network one, so callers handle a single error type.
 */
export async function apiFetch<T>(url: string, init: Omit<RequestInit, 'body'> & { body?: unknown } = {}): Promise<T> {
  const { body, headers, ...rest } = init;
  const hasJsonBody = body !== undefined && !(body instanceof FormData) && typeof body !== 'string';
  let response: Response;
  // Send the request; a thrown fetch means the server was never reached
  try {
    response = await fetch(url, {
      ...rest,
      credentials: 'same-origin',
      headers: {
        Accept: 'application/json',
        ...(hasJsonBody ? { 'Content-Type': 'application/json' } : {}),
        ...headers,
      },
      body: hasJsonBody ? JSON.stringify(body) : (body as BodyInit | undefined),
    });
  } catch {
    throw new ApiError(0, 'Could not reach Boardwright. Check the connection and try again.');
  }
  // No content: nothing to parse
  if (response.status === 204) return undefined as T;
  // Parse the body; a proxy's HTML error page is not JSON, so tolerate that
  const text = await response.text();
  let json: unknown = undefined;
  if (text) {
    try {
      json = JSON.parse(text);
    } catch {
      json = undefined;
    }
  }
  if (response.ok) return json as T;
  // Turn the error body into an ApiError
  const payload = (json ?? {}) as { error?: unknown; issues?: unknown };
  const message =
    typeof payload.error === 'string' && payload.error
      ? payload.error
      : (fallbackMessages[response.status] ?? 'Something went wrong on our side.');
  throw new ApiError(response.status, message, isIssueList(payload.issues) ? payload.issues : [], json);
}

/** The message to show for any thrown value. */
export function errorMessage(error: unknown): string {
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong.';
}
