import {
  importCreateQuerySchema,
  importListQuerySchema,
  importQuerySchema,
  importTextBodySchema,
  uploadFieldName,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import { defineRoute } from '../../lib/route-table';
import { safeFileName, type FileStore } from '../../lib/uploads';
import { idParamsSchema, zodFieldErrors } from '../../lib/validate';
import type { ImportsService } from './imports.service';

/** First bytes of files people upload instead of a CSV. */
function notCsv(bytes: Uint8Array): string | null {
  const starts = (...values: number[]) => values.every((value, i) => bytes[i] === value);
  if (starts(0x50, 0x4b, 0x03, 0x04))
    return 'This is a workbook (e.g. .xlsx), not CSV: save it from the spreadsheet as "CSV (comma delimited)" and upload that.';
  if (starts(0xd0, 0xcf, 0x11, 0xe0))
    return 'This is an old-style workbook (.xls), not CSV: save it from the spreadsheet as "CSV (comma delimited)" and upload that.';
  if (starts(0x25, 0x50, 0x44, 0x46))
    return 'This is a PDF, not CSV: upload the stock list as a .csv file.';
  if (bytes.subarray(0, 4096).includes(0))
    return 'This file is not text, so it cannot be CSV: upload the stock list as a .csv file.';
  return null;
}

export function importRoutes(imports: ImportsService, files: FileStore) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/imports',
      access: 'stock.write',
      query: importListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await imports.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/imports',
      access: 'stock.write',
      before: [files.receiveToMemory],
      query: importCreateQuerySchema,
      handle: async ({ req, res, query, actor }) => {
        let input: { fileName: string; bytes?: Uint8Array; text?: string };
        if (req.file) {
          const problem = notCsv(req.file.buffer);
          if (problem) throw new AppError('unsupported_media_type', problem);
          input = {
            fileName: safeFileName(req.file.originalname, 'import.csv'),
            bytes: req.file.buffer,
          };
        } else if (req.is('application/json')) {
          const parsed = importTextBodySchema.safeParse(req.body ?? {});
          if (!parsed.success) {
            throw AppError.validation(
              'Some field values are not valid.',
              zodFieldErrors(parsed.error),
            );
          }
          input = {
            fileName: safeFileName(parsed.data.fileName, 'import.csv'),
            text: parsed.data.text,
          };
        } else if (req.is('multipart/form-data')) {
          throw AppError.validation(
            `No file was sent: put the CSV in the field "${uploadFieldName}".`,
            {
              [uploadFieldName]: 'is required',
            },
          );
        } else {
          throw new AppError(
            'unsupported_media_type',
            `Send the CSV as multipart/form-data in the field "${uploadFieldName}", or as JSON { "text": "…" }.`,
          );
        }
        const { result, done } = await imports.create(input, actor(), query);
        res.status(done ? 201 : 202).json(result);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/imports/:id',
      access: 'stock.write',
      params: idParamsSchema,
      query: importQuerySchema,
      handle: async ({ params, query, res }) => {
        res.json(await imports.get(params.id, query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/imports/:id/commit',
      access: 'stock.write',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        const { result, done } = await imports.commit(params.id, actor());
        res.status(done ? 200 : 202).json(result);
      },
    }),
  ];
}
