import { z } from 'zod';
import { isoDateSchema } from './dates';
import { listQuerySchema } from './list';
import { refuseControlCharacters } from './names';
import { storedFileSchema } from './uploads';

/** Bought from a supplier, or made in-house by a run. */
export const lotSources = ['purchased', 'prepared'] as const;
export const lotSourceSchema = z.enum(lotSources, { message: 'must be purchased or prepared' });
export type LotSource = (typeof lotSources)[number];

const optionalText = (max: number) =>
  refuseControlCharacters(z.string().trim().max(max, `is at most ${max} characters`))
    .transform((text) => (text === '' ? null : text))
    .nullable();

const lotFields = {
  source: lotSourceSchema,
  /** Supplier name as text for now (a supplier list comes with ordering). */
  supplierName: optionalText(200),
  supplierLotNumber: optionalText(80),
  /** e.g. "ACS reagent", "technical", "USP". */
  grade: optionalText(80),
  /** Mass % from the certificate; the chemical's default purity when left out. */
  purityPercent: z
    .number({ message: 'must be a number' })
    .gt(0, 'must be more than 0 %')
    .max(100, 'cannot be more than 100 %')
    .nullable(),
  receivedOn: isoDateSchema,
  expiresOn: isoDateSchema.nullable(),
  notes: z.string().max(4000, 'is at most 4000 characters'),
};

function expiryAfterReceipt(lot: { receivedOn?: string; expiresOn?: string | null }) {
  return !lot.receivedOn || !lot.expiresOn || lot.expiresOn >= lot.receivedOn;
}
const expiryMessage = { message: 'cannot be before the received date', path: ['expiresOn'] };

/** Record a lot. Containers are added with `POST /api/containers`. */
export const lotCreateSchema = z
  .object({
    chemicalId: z.number({ message: 'must be a chemical id' }).int().positive(),
    ...lotFields,
    source: lotFields.source.default('purchased'),
    supplierName: lotFields.supplierName.default(null),
    supplierLotNumber: lotFields.supplierLotNumber.default(null),
    grade: lotFields.grade.default(null),
    purityPercent: lotFields.purityPercent.default(null),
    expiresOn: lotFields.expiresOn.default(null),
    notes: lotFields.notes.default(''),
  })
  .strict()
  .refine(expiryAfterReceipt, expiryMessage);
export type LotCreate = z.input<typeof lotCreateSchema>;
export type LotCreateParsed = z.output<typeof lotCreateSchema>;

export const lotPatchSchema = z
  .object(lotFields)
  .partial()
  .strict()
  .refine(expiryAfterReceipt, expiryMessage);
export type LotPatch = z.infer<typeof lotPatchSchema>;

export const lotSchema = z.object({
  id: z.number().int(),
  chemicalId: z.number().int(),
  chemicalName: z.string(),
  source: lotSourceSchema,
  supplierName: z.string().nullable(),
  supplierLotNumber: z.string().nullable(),
  grade: z.string().nullable(),
  /** Effective purity: the lot's, or the chemical's default. */
  purityPercent: z.number(),
  receivedOn: z.string(),
  expiresOn: z.string().nullable(),
  /** The run that made a prepared lot (filled in by runs). */
  madeByRunId: z.number().int().nullable(),
  /** Original file name of the certificate of analysis; null when none was uploaded. */
  certificateFileName: z.string().nullable(),
  /**
   * The certificate of analysis (PDF, PNG or JPEG), downloaded from
   * `GET /api/lots/:id/certificate`. Always sent by the server.
   */
  certificate: storedFileSchema.nullable().optional(),
  notes: z.string(),
  /** Containers of this lot that are not disposed. */
  containerCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Lot = z.infer<typeof lotSchema>;

export const lotSortFields = ['receivedOn', 'expiresOn', 'chemical', 'updatedAt'] as const;
export const lotListQuerySchema = listQuerySchema(lotSortFields, 'receivedOn.desc').extend({
  chemicalId: z.coerce.number().int().positive().optional(),
  source: lotSourceSchema.optional(),
});
export type LotListQuery = z.infer<typeof lotListQuerySchema>;
