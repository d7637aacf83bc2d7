import { errorStatus, type ConfirmationWarning, type ErrorCode } from '@lotwise/shared';

/** Field path (dot-separated) -> what is wrong with it. */
export type FieldErrors = Record<string, string>;

/** The one error type of the API; the error middleware turns it into `{ error: { … } }`. */
export class AppError extends Error {
  override name = 'AppError';

  constructor(
    public readonly code: ErrorCode,
    message: string,
    public readonly fields?: FieldErrors,
    /** With `confirmation_required`: what the person is asked to confirm. */
    public readonly warnings?: ConfirmationWarning[],
  ) {
    super(message);
  }

  get status(): number {
    return errorStatus[this.code];
  }

  static validation(message: string, fields?: FieldErrors) {
    return new AppError('validation_failed', message, fields);
  }
  static unauthenticated(message = 'Please sign in first.') {
    return new AppError('unauthenticated', message);
  }
  static forbidden(message = 'Your role does not allow this.') {
    return new AppError('forbidden', message);
  }
  static notFound(message: string) {
    return new AppError('not_found', message);
  }
  static conflict(message: string, fields?: FieldErrors) {
    return new AppError('conflict', message, fields);
  }
  /** 409: nothing was written; the same request with `confirm: true` goes ahead. */
  static confirmationRequired(message: string, warnings: ConfirmationWarning[]) {
    return new AppError('confirmation_required', message, undefined, warnings);
  }
}
