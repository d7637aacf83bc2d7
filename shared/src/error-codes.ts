// The error codes without zod: the web app's first page reads error answers with these alone.

/**
 * The closed set of error codes the API answers with. The web client switches on these,
 * never on message text.
 */
export const errorCodes = [
  'validation_failed',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'confirmation_required',
  'payload_too_large',
  'unsupported_media_type',
  'rate_limited',
  'payment_provider_unavailable',
  'service_unavailable',
  'internal',
] as const;
export type ErrorCode = (typeof errorCodes)[number];

/** HTTP status for each error code. */
export const errorStatus: Record<ErrorCode, number> = {
  validation_failed: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  /** The write needs a person's confirmation: see `error.warnings`, then send it again with `confirm: true`. */
  confirmation_required: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  /** The payment provider did not answer (or answered with a fault); nothing was recorded as paid. */
  payment_provider_unavailable: 503,
  /** Lotwise is starting (checking and migrating its database) or stopping: try again shortly. */
  service_unavailable: 503,
  internal: 500,
};
