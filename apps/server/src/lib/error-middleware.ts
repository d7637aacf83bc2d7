import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ErrorBody } from '@lotwise/shared';
import { z } from 'zod';
import { concurrentWriteConflict } from '../db/sql';
import { AppError } from './app-error';
import type { Logger } from './logger';
import { inRequestContext } from './request-context';
import { routeLabel } from './request-log';
import { zodFieldErrors } from './validate';

/** Errors raised by body-parser carry an HTTP status and a `type`. */
interface BodyParserError {
  type?: string;
  status?: number;
}

function toAppError(error: unknown): AppError | null {
  if (error instanceof AppError) return error;
  if (error instanceof z.ZodError) {
    return AppError.validation('Some values are not valid.', zodFieldErrors(error));
  }
  const parserError = error as BodyParserError;
  if (parserError?.type === 'entity.parse.failed') {
    return AppError.validation('The request body is not valid JSON.');
  }
  if (parserError?.type === 'entity.too.large') {
    return new AppError('payload_too_large', 'The request body is too large.');
  }
  if (parserError?.type === 'encoding.unsupported' || parserError?.type === 'charset.unsupported') {
    return new AppError('unsupported_media_type', 'Send the request body as UTF-8 JSON.');
  }
  return concurrentWriteConflict(error);
}

/** Maps every error to `{ error: { code, message, fields?, warnings? } }`; never sends a stack trace. */
export function errorMiddleware(logger: Logger): ErrorRequestHandler {
  return (error, req, res, _next) => {
    const known = toAppError(error);
    if (!known) {
      inRequestContext(req, res, () =>
        logger.error('Unhandled error', {
          method: req.method,
          route: routeLabel(req),
          error: error instanceof Error ? (error.stack ?? error.message) : String(error),
        }),
      );
    }
    const appError = known ?? new AppError('internal', 'Something went wrong on the server.');
    const body: ErrorBody = {
      error: {
        code: appError.code,
        message: appError.message,
        ...(appError.fields ? { fields: appError.fields } : {}),
        ...(appError.warnings ? { warnings: appError.warnings } : {}),
      },
    };
    if (res.headersSent) return;
    res.status(appError.status).json(body);
  };
}

/** Unknown route: 404 in the usual error shape. */
export const notFoundMiddleware: RequestHandler = (req) => {
  throw AppError.notFound(
    `There is no ${req.method} ${req.originalUrl.split('?')[0]} in the Lotwise API.`,
  );
};
