import { createReadStream, fstat } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { backupNameParamsSchema } from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import { defineRoute } from '../../lib/route-table';
import type { BackupsService } from './backups.service';

/** Admin: the backups folder, a backup now, and downloads (the whole database, every account). */
export function backupRoutes(backups: BackupsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/backups',
      access: 'backups.manage',
      handle: ({ res }) => {
        res.json(backups.list());
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/backups',
      access: 'backups.manage',
      handle: async ({ res, actor }) => {
        res.status(201).json(await backups.takeNow(actor().id));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/backups/:name/download',
      access: 'backups.manage',
      params: backupNameParamsSchema,
      handle: async ({ params, res, actor }) => {
        const file = await backups.fileToDownload(params.name, actor().id);
        // Opened before the headers go out: a backup deleted meanwhile answers 404, not half a file.
        const stream = createReadStream(file);
        const size = await new Promise<number>((resolve, reject) => {
          stream.once('open', (fd) =>
            fstat(fd, (error, stats) => (error ? reject(error) : resolve(stats.size))),
          );
          stream.once('error', () =>
            reject(AppError.notFound(`There is no backup called ${params.name}.`)),
          );
        });
        res.status(200);
        res.attachment(params.name);
        res.setHeader('Content-Type', 'application/vnd.sqlite3');
        res.setHeader('Content-Length', String(size));
        try {
          await pipeline(stream, res);
        } catch (error) {
          res.destroy(error instanceof Error ? error : new Error(String(error)));
        }
      },
    }),
  ];
}
