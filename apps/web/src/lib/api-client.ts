import { errorCodes, type ConfirmationWarning, type ErrorCode } from '@lotwise/shared';
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

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

interface ErrorBody {
  code: ErrorCode;
  message: string;
  fields: Record<string, string>;
  warnings: ConfirmationWarning[];
}

/**
 * The uniform error body `{ error: { code, message, fields?, warnings? } }` (errorBodySchema
 * in `@lotwise/shared`), read without zod so that the first page does not load it: a code
 * outside the closed list, or a body of another shape, answers null.
 */
function readErrorBody(body: unknown): ErrorBody | null {
  const error = isRecord(body) ? body.error : undefined;
  if (!isRecord(error) || typeof error.message !== 'string') return null;
  const code = errorCodes.find((known) => known === error.code);
  if (!code) return null;
  const fields = isRecord(error.fields)
    ? Object.fromEntries(
        Object.entries(error.fields).filter(
          (entry): entry is [string, string] => typeof entry[1] === 'string',
        ),
      )
    : {};
  const warnings = Array.isArray(error.warnings)
    ? (error.warnings.filter(
        (warning) =>
          isRecord(warning) &&
          typeof warning.kind === 'string' &&
          typeof warning.message === 'string',
      ) as ConfirmationWarning[])
    : [];
  return { code, message: error.message, fields, warnings };
}

/** Reads an error response into an ApiError, tolerating bodies that are not ours. */
export async function toApiError(response: Response): Promise<ApiError> {
  let body: unknown;
  try {
    body = await response.json();
  } catch (_error) {
    body = undefined;
  }
  const read = readErrorBody(body);
  if (read)
    return new ApiError(response.status, read.code, read.message, read.fields, read.warnings);
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

/**
 * Checks an answer against its contract schema in development and tests (vitest, `npm run
 * dev`), where a server and a page that disagree should fail loudly. A production build
 * trusts its own server and returns the JSON as it came: the schemas describe answers, they
 * do not change them (no defaults or transforms are relied on), so both give the same data.
 */
export function checkAnswer<T>(status: number, json: unknown, schema?: z.ZodType<T>): T {
  if (!schema || !import.meta.env.DEV) return json as T;
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError(
      status,
      'bad_response',
      'The server answered in a shape this version of Lotwise does not expect.',
    );
  }
  return parsed.data;
}

interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  /** The answer's contract, checked in development and tests (see {@link checkAnswer}). */
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
  return checkAnswer(response.status, json, options.schema);
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
