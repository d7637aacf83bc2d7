import { z } from 'zod';
import { confirmationWarningSchema } from './confirmations';
import { errorCodes } from './error-codes';

export * from './error-codes';

/** Body of every error response: `{ error: { code, message, fields?, warnings? } }`. */
export const errorBodySchema = z.object({
  error: z.object({
    code: z.enum(errorCodes),
    message: z.string(),
    /** Field path (dot-separated, e.g. `ghsPictograms.1`) -> what is wrong with it. */
    fields: z.record(z.string(), z.string()).optional(),
    /** With `confirmation_required`: what the person is asked to confirm. */
    warnings: z.array(confirmationWarningSchema).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
