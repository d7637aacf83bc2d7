import { vi } from 'vitest';

export interface RecordedRequest {
  method: string;
  url: URL;
  body: unknown;
}

type Reply =
  | { status?: number; body?: unknown }
  | ((request: RecordedRequest) => { status?: number; body?: unknown });

/**
 * Stands in for the browser's `fetch` — the network boundary, nothing of ours. Routes are
 * `"METHOD /path"` (query string ignored); anything unrouted answers 404 in the API's shape.
 */
export function mockFetch(routes: Record<string, Reply>) {
  const requests: RecordedRequest[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(String(input), 'http://lotwise.test');
    const method = (init?.method ?? 'GET').toUpperCase();
    const request: RecordedRequest = {
      method,
      url,
      body:
        typeof init?.body === 'string'
          ? JSON.parse(init.body)
          : init?.body instanceof FormData
            ? formDataFields(init.body)
            : undefined,
    };
    requests.push(request);
    const reply = routes[`${method} ${url.pathname}`];
    const answer = typeof reply === 'function' ? reply(request) : reply;
    if (!answer) {
      return jsonResponse(404, {
        error: { code: 'not_found', message: `No route ${method} ${url.pathname}` },
      });
    }
    return jsonResponse(answer.status ?? 200, answer.body ?? null);
  });
  vi.stubGlobal('fetch', fetchMock);
  return { fetchMock, requests };
}

/** A multipart body as the test reads it: field -> value, or the file's name for a file. */
function formDataFields(form: FormData): Record<string, string> {
  const fields: Record<string, string> = {};
  form.forEach((value, key) => {
    fields[key] = typeof value === 'string' ? value : value.name;
  });
  return fields;
}

export function jsonResponse(status: number, body: unknown): Response {
  return new Response(status === 204 ? null : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });
}
