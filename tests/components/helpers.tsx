import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import { vi } from 'vitest';

/** Renders inside a fresh query cache with retries off, so a failure shows at once. */
export function renderWithQuery(ui: React.ReactElement) {
  const client = new QueryClient({
    defaultOptions: { queries: { retry: false }, mutations: { retry: false } },
  });
  return { client, ...render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>) };
}

/** A JSON response as the API sends it. */
export function json(body: unknown, status = 200): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });
}

/** Replaces the global fetch with a mock answering each call in turn. */
export function mockFetch(...responses: Array<Response | (() => Response)>) {
  const fn = vi.fn(async (_url: string | URL | Request, _init?: RequestInit) => {
    const next = responses.shift();
    if (!next) throw new Error('fetch was called more often than the test expected');
    return typeof next === 'function' ? next() : next;
  });
  vi.stubGlobal('fetch', fn);
  return fn;
}

/** The parsed JSON body of the n-th fetch call. */
export function sentBody(fn: ReturnType<typeof mockFetch>, call = 0): unknown {
  const init = fn.mock.calls[call]?.[1];
  return init?.body ? JSON.parse(String(init.body)) : undefined;
}
