import type { EntityManager } from 'typeorm';
import { ScheduledRunEntity } from './scheduled-run.entity';

/** Data access for `scheduled_runs` (see the entity). */
export function scheduledRunsRepository(manager: EntityManager) {
  const runs = manager.getRepository(ScheduledRunEntity);
  return {
    /**
     * Claims this turn of job `name` at `now` when it last started at or before `dueIfBefore`
     * (or never): true for exactly one of several instances claiming at once — the conditional
     * update is one statement, which the database applies to the row one at a time.
     */
    async claimTurn(name: string, now: string, dueIfBefore: string): Promise<boolean> {
      // the first claim ever makes the row; a second one racing it finds the row there
      await runs
        .createQueryBuilder()
        .insert()
        .values({ name, lastStartedAt: '0000-00-00T00:00:00.000Z' })
        .orIgnore()
        .updateEntity(false)
        .execute();
      const result = await runs
        .createQueryBuilder()
        .update()
        .set({ lastStartedAt: now })
        .where('name = :name AND last_started_at <= :dueIfBefore', { name, dueIfBefore })
        .execute();
      return (result.affected ?? 0) === 1;
    },
  };
}
