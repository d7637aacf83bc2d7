import { errorBodySchema, type ConfirmationWarning, type ErrorCode } from '@lotwise/shared';
import type { z } from 'zod';

/** An error answered by the Lotwise API (or a failure to reach it), carrying the uniform body. */
export class ApiError extends Error {
  override readonly name = 'ApiError';

  constructor(
    readonly status: number,
    readonly code: ErrorCode | 'network_error' | 'bad_response',
    message: string,
    /** Field path (e.g. `ghsPictograms.1`) -> what is wrong with it. */
    readonly fields: Record<string, string> = {},
    /** With `confirmation_required`: what the person is asked to confirm before sending again. */
    readonly warnings: ConfirmationWarning[] = [],
  ) {
    super(message);
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type UnauthenticatedHandler = () => void;
let onUnauthenticated: UnauthenticatedHandler = () => {};

/** Called once by the app: what to do when any request answers 401 (send to sign-in). */
export function setUnauthenticatedHandler(handler: UnauthenticatedHandler): void {
  onUnauthenticated = handler;
}

/** Runs the app's 401 handling; for requests made without {@link apiRequest} (uploads). */
export function notifyUnauthenticated(): void {
  onUnauthenticated();
}

/** Reads an error response into an ApiError, tolerating bodies that are not ours. */
export async function toApiError(response: Response): Promise<ApiError> {
  let body: unknown;
  try {
    body = await response.json();
  } catch (_error) {
    body = undefined;
  }
  const parsed = errorBodySchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields, warnings } = parsed.data.error;
    return new ApiError(response.status, code, message, fields ?? {}, warnings ?? []);
  }
  const fallback =
    response.status >= 500
      ? 'The Lotwise server had a problem answering. Try again in a moment.'
      : `The server answered ${response.status} ${response.statusText}`.trim();
  return new ApiError(
    response.status,
    response.status >= 500 ? 'internal' : 'bad_response',
    fallback,
  );
}

interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  /** Checks the answer against the contract; without it the JSON is returned as is. */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
  /** Skip the global 401 handling (the sign-in and session check handle it themselves). */
  allowUnauthenticated?: boolean;
}

/** Calls the Lotwise API: same-origin cookies, JSON in and out, typed errors. */
export async function apiRequest<T = unknown>(
  path: string,
  options: RequestOptions<T> = {},
): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method: options.method ?? 'GET',
      credentials: 'same-origin',
      headers,
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(
      0,
      'network_error',
      'Lotwise could not reach its server. Check the connection and try again.',
    );
  }

  if (!response.ok) {
    const error = await toApiError(response);
    if (response.status === 401 && !options.allowUnauthenticated) onUnauthenticated();
    throw error;
  }
  if (response.status === 204) return undefined as T;

  let json: unknown;
  try {
    json = await response.json();
  } catch (_error) {
    throw new ApiError(
      response.status,
      'bad_response',
      'The server answered with something that is not JSON.',
    );
  }
  if (!options.schema) return json as T;
  const parsed = options.schema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError(
      response.status,
      'bad_response',
      'The server answered in a shape this version of Lotwise does not expect.',
    );
  }
  return parsed.data;
}

export const api = {
  get: <T>(path: string, schema?: z.ZodType<T>, signal?: AbortSignal) =>
    apiRequest<T>(path, { schema, signal }),
  post: <T>(path: string, body?: unknown, schema?: z.ZodType<T>) =>
    apiRequest<T>(path, { method: 'POST', body, schema }),
  patch: <T>(path: string, body: unknown, schema?: z.ZodType<T>) =>
    apiRequest<T>(path, { method: 'PATCH', body, schema }),
  delete: (path: string) => apiRequest<void>(path, { method: 'DELETE' }),
};

/** Builds `path?a=1&b=2`, leaving out empty values. */
export function withQuery(
  path: string,
  params: Record<string, string | number | undefined | null>,
): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === null || value === '') continue;
    search.set(key, String(value));
  }
  const query = search.toString();
  return query ? `${path}?${query}` : path;
}

/** Shows the warnings of a `confirmation_required` answer; resolves true when the person goes ahead. */
export type AskConfirmation = (
  warnings: ConfirmationWarning[],
  message: string,
) => Promise<boolean>;

/**
 * Send → confirm → send again: runs `send(false)`; when the server answers 409
 * `confirmation_required`, asks the person with the warnings it named and, if they go ahead,
 * runs `send(true)` (the same request with `confirm: true`). Resolves null when they decline:
 * nothing was written. Any other error is thrown as it came.
 */
export async function sendWithConfirmation<T>(
  send: (confirm: boolean) => Promise<T>,
  ask: AskConfirmation,
): Promise<T | null> {
  try {
    return await send(false);
  } catch (error) {
    if (!isApiError(error) || error.code !== 'confirmation_required') throw error;
    if (!(await ask(error.warnings, error.message))) return null;
    return send(true);
  }
}

/** A person-readable sentence for any error a query or mutation throws. */
export function errorMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}
