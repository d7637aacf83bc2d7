import { FakeApiError } from './api-error';

/**
 * Reading form-encoded parameters as the provider does: every value arrives as a string,
 * nested keys (`line_items[0][price_data][unit_amount]`) arrive as objects and arrays.
 */
export type Params = Record<string, unknown>;

export function asParams(value: unknown, param: string): Params {
  if (value === undefined || value === '') return {};
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw FakeApiError.invalid(`Invalid object`, param);
  }
  return value as Params;
}

/** Refuses parameters the fake does not know, as the provider refuses unknown ones. */
export function onlyKnown(params: Params, known: readonly string[], prefix = ''): void {
  for (const key of Object.keys(params)) {
    if (!known.includes(key)) {
      const name = prefix ? `${prefix}[${key}]` : key;
      throw FakeApiError.invalid(`Received unknown parameter: ${name}`, name, 'parameter_unknown');
    }
  }
}

export function optionalString(params: Params, key: string, param = key): string | null {
  const value = params[key];
  if (value === undefined || value === '') return null;
  if (typeof value !== 'string') throw FakeApiError.invalid(`Invalid string: ${param}`, param);
  return value;
}

export function requiredString(params: Params, key: string, param = key): string {
  const value = optionalString(params, key, param);
  if (value === null) throw FakeApiError.missingParam(param);
  return value;
}

export function optionalInteger(params: Params, key: string, param = key, min = 0): number | null {
  const text = optionalString(params, key, param);
  if (text === null) return null;
  if (!/^-?\d+$/.test(text) || Number(text) < min || !Number.isSafeInteger(Number(text))) {
    throw FakeApiError.invalid(
      `Invalid integer: ${text}${min > 0 ? ` (must be at least ${min})` : ''}`,
      param,
    );
  }
  return Number(text);
}

export function requiredInteger(params: Params, key: string, param = key, min = 0): number {
  const value = optionalInteger(params, key, param, min);
  if (value === null) throw FakeApiError.missingParam(param);
  return value;
}

/** `metadata`: up to 50 string keys of at most 40 characters, values of at most 500. */
export function metadata(params: Params, key: string, param = key): Record<string, string> {
  const raw = asParams(params[key], param);
  const entries = Object.entries(raw);
  if (entries.length > 50) throw FakeApiError.invalid('Metadata can have up to 50 keys', param);
  const result: Record<string, string> = {};
  for (const [name, value] of entries) {
    if (name.length > 40) {
      throw FakeApiError.invalid(`Metadata keys can be at most 40 characters`, `${param}[${name}]`);
    }
    if (typeof value !== 'string' || value.length > 500) {
      throw FakeApiError.invalid(
        `Metadata values must be strings of at most 500 characters`,
        `${param}[${name}]`,
      );
    }
    result[name] = value;
  }
  return result;
}

/** `expand[]`: the paths to answer inline instead of as ids. */
export function expandList(value: unknown): string[] {
  if (value === undefined) return [];
  const list = Array.isArray(value)
    ? value
    : typeof value === 'object' && value
      ? Object.values(value)
      : [value];
  return list.filter((item): item is string => typeof item === 'string');
}

/** A stable text of the parameters: the same request always gives the same text. */
export function fingerprint(method: string, path: string, params: unknown): string {
  const stable = (value: unknown): unknown => {
    if (Array.isArray(value)) return value.map(stable);
    if (value && typeof value === 'object') {
      return Object.fromEntries(
        Object.keys(value)
          .sort()
          .map((key) => [key, stable((value as Params)[key])]),
      );
    }
    return value;
  };
  return `${method} ${path} ${JSON.stringify(stable(params ?? {}))}`;
}
