import {
  clientIdSchema,
  runPhotoMaxBytes,
  runPhotoSchema,
  runTimelineSchema,
  timelineAppendResultSchema,
  timelineEntryInputSchema,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import { defineRoute } from '../../lib/route-table';
import type { FileStore } from '../../lib/uploads';
import { idParamsSchema } from '../../lib/validate';
import type { RunPhotosService } from './run-photos.service';
import type { RunTimelineService } from './run-timeline.service';

const photoParamsSchema = idParamsSchema.extend({ photoId: idParamsSchema.shape.id });

/** A run's timeline at the bench: entries (readings, notes, steps, timers) and photos. */
export function runTimelineRoutes(
  timeline: RunTimelineService,
  photos: RunPhotosService,
  files: FileStore,
) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/runs/:id/timeline',
      access: 'procedures.read',
      summary: "Read a run's timeline: steps, entries, running timers, deviations",
      response: { schema: runTimelineSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await timeline.timeline(params.id));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/runs/:id/timeline',
      access: 'runs.record',
      summary: "Add an entry to a run's timeline (a resend of the same client id stores nothing)",
      response: {
        status: 201,
        schema: timelineAppendResultSchema,
        description:
          'The stored entry; 200 with `created: false` when the client id was sent before.',
      },
      params: idParamsSchema,
      body: timelineEntryInputSchema,
      handle: async ({ params, body, res, actor }) => {
        const result = await timeline.append(params.id, body, actor());
        res.status(result.created ? 201 : 200).json(result);
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/runs/:id/photos',
      access: 'runs.record',
      summary: 'Upload a photo taken during a run (multipart `file` and `clientId`)',
      response: {
        status: 201,
        schema: runPhotoSchema,
        description: 'The stored photo; 200 when the client id was sent before.',
      },
      params: idParamsSchema,
      before: [files.receiveToDiskUpTo(runPhotoMaxBytes)],
      handle: async ({ params, req, res, actor }) => {
        try {
          const file = files.uploaded(req, 'the photo (JPEG, PNG or WebP)');
          const given: unknown = (req.body as { clientId?: unknown } | undefined)?.clientId;
          const parsed = clientIdSchema.safeParse(given);
          if (!parsed.success) {
            const message =
              given === undefined || given === ''
                ? 'is required'
                : (parsed.error.issues[0]?.message ?? 'is not a client id');
            throw AppError.validation(`The field clientId ${message}.`, { clientId: message });
          }
          const result = await photos.put(params.id, parsed.data, file, actor());
          res.status(result.created ? 201 : 200).json(result.photo);
        } finally {
          await files.discard(req.file);
        }
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/runs/:id/photos/:photoId',
      access: 'procedures.read',
      summary: 'Download a photo of a run',
      response: { contentType: 'image/*', description: 'The photo as stored: JPEG, PNG or WebP.' },
      params: photoParamsSchema,
      handle: async ({ params, res }) => {
        const file = await photos.photo(params.id, params.photoId);
        await files.send(res, file, file.what, { inline: true });
      },
    }),
  ];
}
