import type { RequestHandler, Response } from 'express';
import { z } from 'zod';
import { AppError, type FieldErrors } from './app-error';

/** Missing values read "is required" instead of zod's "expected string, received undefined". */
const parseContext = {
  error: (issue: { input?: unknown }) => (issue.input === undefined ? 'is required' : undefined),
};

/** Turns zod issues into `{ 'dot.path': message }`; unknown keys are named one by one. */
export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  const add = (path: PropertyKey[], message: string) => {
    const key = path.map(String).join('.') || '_';
    fields[key] ??= message;
  };
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) add([...issue.path, key], 'is not a known field');
    } else {
      add(issue.path, issue.message);
    }
  }
  return fields;
}

function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown, what: string): z.output<S> {
  const result = schema.safeParse(value, parseContext);
  if (!result.success) {
    throw AppError.validation(`Some ${what} values are not valid.`, zodFieldErrors(result.error));
  }
  return result.data;
}

/** Keys that reach an object's prototype when copied with `Object.assign` or a merge. */
const forbiddenKeys = new Set(['__proto__', 'constructor', 'prototype']);

/**
 * The path (`items.0.__proto__`) of the first `__proto__`, `constructor` or `prototype` key
 * at any depth of a parsed JSON value, or null. Walks without recursion, so a deeply nested
 * body cannot overflow the stack.
 */
export function forbiddenKeyPath(value: unknown): string | null {
  interface Step {
    value: unknown;
    key: string | null;
    parent: Step | null;
  }
  const pathOf = (step: Step): string => {
    const keys: string[] = [];
    for (let at: Step | null = step; at?.key != null; at = at.parent) keys.push(at.key);
    return keys.reverse().join('.');
  };
  const pending: Step[] = [{ value, key: null, parent: null }];
  while (pending.length > 0) {
    const step = pending.pop()!;
    if (step.value === null || typeof step.value !== 'object') continue;
    // A raw body (the payment webhook) is bytes, not keys.
    if (ArrayBuffer.isView(step.value)) continue;
    // JSON.parse makes `"__proto__"` an own key, so Object.keys sees it.
    for (const key of Object.keys(step.value)) {
      const child: Step = {
        value: (step.value as Record<string, unknown>)[key],
        key,
        parent: step,
      };
      if (forbiddenKeys.has(key)) return pathOf(child);
      pending.push(child);
    }
  }
  return null;
}

function refuseForbiddenKeys(value: unknown, what: string) {
  const path = forbiddenKeyPath(value);
  if (path === null) return;
  const key = path.split('.').at(-1)!;
  throw AppError.validation(`The ${what} holds the key "${key}", which Lotwise never accepts.`, {
    [path]: `"${key}" is not an allowed key`,
  });
}

export interface RequestSchemas {
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
}

export interface ParsedInput {
  body: unknown;
  query: unknown;
  params: unknown;
}

function sentBodyThatIsNotJson(req: Parameters<RequestHandler>[0]): boolean {
  const hasBody =
    Number(req.headers['content-length'] ?? 0) > 0 || req.headers['transfer-encoding'] != null;
  return hasBody && req.body === undefined && !req.is('application/json');
}

/**
 * Refuses `__proto__`, `constructor` and `prototype` keys anywhere in the body or query
 * (400 naming the key), validates params, query and body against the schemas and keeps the
 * parsed values on `res.locals.input` (Express 5 makes `req.query` a getter, so it cannot be
 * replaced).
 */
export function validate(schemas: RequestSchemas): RequestHandler {
  return (req, res, next) => {
    if (schemas.body && sentBodyThatIsNotJson(req)) {
      throw new AppError('unsupported_media_type', 'Send the request body as application/json.');
    }
    refuseForbiddenKeys(req.body, 'request body');
    refuseForbiddenKeys(req.query, 'query');
    const input: ParsedInput = {
      params: schemas.params ? parseOrThrow(schemas.params, req.params, 'path') : req.params,
      query: schemas.query ? parseOrThrow(schemas.query, req.query, 'query') : req.query,
      body: schemas.body ? parseOrThrow(schemas.body, req.body ?? {}, 'field') : undefined,
    };
    res.locals.input = input;
    next();
  };
}

/** The values `validate()` parsed for this request. */
export function parsedInput(res: Response): ParsedInput {
  return (
    (res.locals.input as ParsedInput | undefined) ?? { body: undefined, query: {}, params: {} }
  );
}

/** `:id` path parameter: a positive whole number, otherwise 400 naming `id`. */
export const idParamsSchema = z.object({
  id: z
    .string()
    .regex(/^[1-9]\d{0,14}$/, 'must be a positive whole number')
    .transform(Number),
});
