import type { Request } from 'express';
import { defineRoute } from '../../lib/route-table';
import type { FileStore } from '../../lib/uploads';
import { idParamsSchema } from '../../lib/validate';
import type { UploadsService } from './uploads.service';

/** SDS per chemical, certificate of analysis per lot: upload (multipart `file`), download, delete. */
export function uploadRoutes(uploads: UploadsService, files: FileStore) {
  /** Runs `work` with the request's upload; the temporary file never outlives the request. */
  async function withUpload<T>(
    req: Request,
    what: string,
    work: (file: Express.Multer.File) => Promise<T>,
  ) {
    try {
      return await work(files.uploaded(req, what));
    } finally {
      await files.discard(req.file);
    }
  }

  return [
    defineRoute({
      method: 'post',
      path: '/api/chemicals/:id/sds',
      access: 'chemicals.write',
      params: idParamsSchema,
      before: [files.receiveToDisk],
      handle: async ({ params, req, res }) => {
        const chemical = await withUpload(req, 'the safety data sheet (PDF)', (file) =>
          uploads.putSds(params.id, file),
        );
        res.status(201).json(chemical);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/chemicals/:id/sds',
      access: 'chemicals.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        const file = await uploads.sds(params.id);
        await files.send(res, file, file.what);
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/chemicals/:id/sds',
      access: 'chemicals.write',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await uploads.removeSds(params.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/lots/:id/certificate',
      access: 'stock.write',
      params: idParamsSchema,
      before: [files.receiveToDisk],
      handle: async ({ params, req, res }) => {
        const lot = await withUpload(req, 'the certificate (PDF, PNG or JPEG)', (file) =>
          uploads.putCertificate(params.id, file),
        );
        res.status(201).json(lot);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/lots/:id/certificate',
      access: 'stock.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        const file = await uploads.certificate(params.id);
        await files.send(res, file, file.what);
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/lots/:id/certificate',
      access: 'stock.write',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await uploads.removeCertificate(params.id);
        res.status(204).end();
      },
    }),
  ];
}
