import type { DeviationReason, TimelineKind } from '@lotwise/chem';
import { EntitySchema } from 'typeorm';
import { foreignKey } from '../../db/entity-relations';

/**
 * A row of `run_timeline_entries`: one thing that happened during a run (a reading, a note, a
 * photo, a step or timer started or ended), at the time it happened (`at`, UTC ISO), with the
 * deviation it made when it was appended. Unique per run by the device's `clientId`.
 */
export interface RunTimelineEntryRow {
  id: number;
  runId: number;
  clientId: string;
  kind: TimelineKind;
  at: string;
  stepIndex: number | null;
  temperatureC: number | null;
  text: string;
  /** A photo of the same run (`run_photos.id`). */
  uploadId: number | null;
  durationMinutes: number | null;
  endsAt: string | null;
  /** A timer-end: the client id of the timer-start it stopped. */
  timerClientId: string | null;
  deviationReason: DeviationReason | null;
  deviationStepIndex: number | null;
  deviationMessage: string | null;
  /** The step's "when outside the window" text as it read when the entry was made. */
  deviationInstruction: string | null;
  recordedById: number | null;
  receivedAt: string;
  /** Declared so the foreign keys are part of the mapping; never loaded. */
  run?: unknown;
  upload?: unknown;
  recordedBy?: unknown;
}

export const RunTimelineEntryEntity = new EntitySchema<RunTimelineEntryRow>({
  name: 'RunTimelineEntry',
  tableName: 'run_timeline_entries',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    runId: { name: 'run_id', type: 'integer' },
    clientId: { name: 'client_id', type: 'varchar', length: 64 },
    kind: { type: 'varchar', length: 12 },
    at: { type: 'varchar', length: 24 },
    stepIndex: { name: 'step_index', type: 'integer', nullable: true },
    temperatureC: { name: 'temperature_c', type: 'double precision', nullable: true },
    text: { type: 'text' },
    uploadId: { name: 'upload_id', type: 'integer', nullable: true },
    durationMinutes: { name: 'duration_minutes', type: 'double precision', nullable: true },
    endsAt: { name: 'ends_at', type: 'varchar', length: 24, nullable: true },
    timerClientId: { name: 'timer_client_id', type: 'varchar', length: 64, nullable: true },
    deviationReason: { name: 'deviation_reason', type: 'varchar', length: 30, nullable: true },
    deviationStepIndex: { name: 'deviation_step_index', type: 'integer', nullable: true },
    deviationMessage: { name: 'deviation_message', type: 'text', nullable: true },
    deviationInstruction: { name: 'deviation_instruction', type: 'text', nullable: true },
    recordedById: { name: 'recorded_by_id', type: 'integer', nullable: true },
    receivedAt: { name: 'received_at', type: 'varchar', length: 24 },
  },
  relations: {
    run: foreignKey('Run', 'run_id', 'run_timeline_entries_run_fk', 'RESTRICT'),
    upload: foreignKey('RunPhoto', 'upload_id', 'run_timeline_entries_upload_fk', 'RESTRICT', true),
    recordedBy: foreignKey(
      'User',
      'recorded_by_id',
      'run_timeline_entries_recorded_by_fk',
      'SET NULL',
      true,
    ),
  },
  indices: [
    {
      name: 'run_timeline_entries_client_unique',
      columns: ['runId', 'clientId'],
      unique: true,
    },
    { name: 'run_timeline_entries_run_at_idx', columns: ['runId', 'at'] },
    { name: 'run_timeline_entries_upload_idx', columns: ['uploadId'] },
  ],
});
