/**
 * An error answered in the provider's shape: `{ error: { type, code, message, param, decline_code } }`.
 * The SDK picks its error class from the HTTP status (400/404 invalid request — or idempotency
 * error when `type` is `idempotency_error` — 401 authentication, 402 card, 429 rate limit, 5xx API).
 */
export class FakeApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly type:
      | 'invalid_request_error'
      | 'idempotency_error'
      | 'card_error'
      | 'api_error'
      | 'rate_limit_error',
    message: string,
    public readonly code: string | null = null,
    public readonly param: string | null = null,
    public readonly declineCode: string | null = null,
  ) {
    super(message);
  }

  body() {
    return {
      error: {
        type: this.type,
        code: this.code ?? undefined,
        message: this.message,
        param: this.param ?? undefined,
        decline_code: this.declineCode ?? undefined,
      },
    };
  }

  static invalid(message: string, param: string | null = null, code = 'parameter_invalid') {
    return new FakeApiError(400, 'invalid_request_error', message, code, param);
  }

  static missingParam(param: string) {
    return new FakeApiError(
      400,
      'invalid_request_error',
      `Missing required param: ${param}.`,
      'parameter_missing',
      param,
    );
  }

  static noSuch(objectName: string, id: string, param = 'id') {
    return new FakeApiError(
      404,
      'invalid_request_error',
      `No such ${objectName}: '${id}'`,
      'resource_missing',
      param,
    );
  }
}
