import { EntitySchema } from 'typeorm';

/**
 * A row of `scheduled_runs`: when a periodic job of the whole lab (the scheduled evaluation
 * of the alert rules) last started. Every app instance has a timer for it; the instance whose
 * claim moves `lastStartedAt` runs the job, the others skip that turn, so with several
 * instances on one database the job still runs once per interval.
 */
export interface ScheduledRunRow {
  name: string;
  lastStartedAt: string;
}

export const ScheduledRunEntity = new EntitySchema<ScheduledRunRow>({
  name: 'ScheduledRun',
  tableName: 'scheduled_runs',
  columns: {
    name: { type: 'varchar', length: 60, primary: true },
    lastStartedAt: { name: 'last_started_at', type: 'varchar', length: 24 },
  },
});
