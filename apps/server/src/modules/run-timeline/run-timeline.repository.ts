import type { EntityManager } from 'typeorm';
import { RunPhotoEntity, type RunPhotoRow } from './run-photo.entity';
import { RunTimelineEntryEntity, type RunTimelineEntryRow } from './run-timeline-entry.entity';

export type TimelineEntryValues = Omit<RunTimelineEntryRow, 'id' | 'run' | 'upload' | 'recordedBy'>;
export type RunPhotoValues = Omit<RunPhotoRow, 'id' | 'run' | 'uploadedBy'>;

/** Data access for `run_timeline_entries` and `run_photos`; answers plain objects. */
export function runTimelineRepository(manager: EntityManager) {
  const entries = manager.getRepository(RunTimelineEntryEntity);
  const photos = manager.getRepository(RunPhotoEntity);
  return {
    /** Every entry of a run, by the time it happened, then by arrival. */
    async entriesOf(runId: number): Promise<RunTimelineEntryRow[]> {
      return entries.find({ where: { runId }, order: { at: 'ASC', id: 'ASC' } });
    },
    async entryByClientId(runId: number, clientId: string): Promise<RunTimelineEntryRow | null> {
      return entries.findOneBy({ runId, clientId });
    },
    async insertEntry(values: TimelineEntryValues): Promise<number> {
      const result = await entries.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async entryById(id: number): Promise<RunTimelineEntryRow | null> {
      return entries.findOneBy({ id });
    },
    /** Entries with a deviation, per run (runs without any are left out). */
    async deviationCounts(runIds: number[]): Promise<Map<number, number>> {
      if (runIds.length === 0) return new Map();
      const rows: { runId: number | string; count: number | string }[] = await entries
        .createQueryBuilder('e')
        .select('e.run_id', 'runId')
        .addSelect('COUNT(*)', 'count')
        .where('e.run_id IN (:...runIds)', { runIds })
        .andWhere('e.deviation_reason IS NOT NULL')
        .groupBy('e.run_id')
        .getRawMany();
      return new Map(rows.map((row) => [Number(row.runId), Number(row.count)]));
    },
    async photoOf(runId: number, photoId: number): Promise<RunPhotoRow | null> {
      return photos.findOneBy({ runId, id: photoId });
    },
    async photoByClientId(runId: number, clientId: string): Promise<RunPhotoRow | null> {
      return photos.findOneBy({ runId, clientId });
    },
    async photosOf(runId: number): Promise<RunPhotoRow[]> {
      return photos.find({ where: { runId }, order: { id: 'ASC' } });
    },
    async insertPhoto(values: RunPhotoValues): Promise<number> {
      const result = await photos.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    /** Removes a run's entries and photo rows (the files are the caller's). */
    async deleteOfRun(runId: number): Promise<void> {
      await entries.delete({ runId });
      await photos.delete({ runId });
    },
  };
}
export type RunTimelineRepository = ReturnType<typeof runTimelineRepository>;
