import { runPhotoContentTypes, type RunPhoto, type User } from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { FileStore } from '../../lib/uploads';
import type { Store } from '../../db/store';
import { isUniqueViolation, nowIso } from '../../db/sql';
import { requireRun } from '../runs/run-views';
import { requireMayAddTo } from './run-timeline.service';
import { presentPhoto } from './timeline-view';

/**
 * Photos taken at the bench during a run: an image checked by its content, kept in the upload
 * folder, stored once per client id (a resend answers the stored photo and keeps nothing new).
 */
export function runPhotosService(store: Store, files: FileStore) {
  return {
    async put(
      runId: number,
      clientId: string,
      upload: Express.Multer.File,
      actor: User,
    ): Promise<{ photo: RunPhoto; created: boolean }> {
      const run = await requireRun(store.repos, runId);
      requireMayAddTo(run, actor);
      const stored = await store.repos.runTimeline.photoByClientId(runId, clientId);
      if (stored) {
        await files.discard(upload);
        return { photo: presentPhoto(stored), created: false };
      }
      const kept = await files.keep(upload, runPhotoContentTypes, 'A photo', 'photo.jpg');
      try {
        const row = await store.transaction(async (repos) => {
          const locked = await requireRun(repos, runId);
          requireMayAddTo(locked, actor);
          const values = {
            runId,
            clientId,
            fileName: kept.fileName,
            storedName: kept.storedName,
            size: kept.size,
            contentType: kept.contentType,
            uploadedAt: nowIso(),
            uploadedById: actor.id,
          };
          return { id: await repos.runTimeline.insertPhoto(values), ...values };
        });
        return { photo: presentPhoto(row), created: true };
      } catch (error) {
        await files.remove(kept.storedName);
        if (isUniqueViolation(error)) {
          const other = await store.repos.runTimeline.photoByClientId(runId, clientId);
          if (other) return { photo: presentPhoto(other), created: false };
        }
        throw error;
      }
    },

    /** A photo of the run, to send (404 when it is not one of this run's). */
    async photo(runId: number, photoId: number) {
      const row = await store.repos.runTimeline.photoOf(runId, photoId);
      if (!row) throw AppError.notFound(`Run #${runId} has no photo #${photoId}.`);
      return {
        what: `photo #${photoId} of run #${runId}`,
        storedName: row.storedName,
        fileName: row.fileName,
        contentType: row.contentType,
      };
    },
  };
}
export type RunPhotosService = ReturnType<typeof runPhotosService>;
