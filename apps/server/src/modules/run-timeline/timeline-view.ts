import { currentStepAt, temperatureWindowText, type TimelineEvent } from '@lotwise/chem';
import type {
  DeviationView,
  ProcedureStep,
  RunPhoto,
  RunTimeline,
  TimelineEntry,
} from '@lotwise/shared';
import type { LoadedProcedure } from '../procedures/procedures.service';
import { scaledLineDisplays } from '../procedures/procedures.service';
import type { RunRow } from '../runs/run.entity';
import type { UserRow } from '../users/user.entity';
import type { RunPhotoRow } from './run-photo.entity';
import type { RunTimelineEntryRow } from './run-timeline-entry.entity';

/** Where a photo of a run is fetched from. */
export function photoUrl(runId: number, photoId: number): string {
  return `/api/runs/${runId}/photos/${photoId}`;
}

/** An entry as the timeline rules read it. */
export function eventOf(row: RunTimelineEntryRow): TimelineEvent {
  return { kind: row.kind, at: row.at, stepIndex: row.stepIndex, temperatureC: row.temperatureC };
}

function deviationOfRow(row: RunTimelineEntryRow): DeviationView | null {
  if (row.deviationReason === null) return null;
  return {
    reason: row.deviationReason,
    stepIndex: row.deviationStepIndex ?? row.stepIndex ?? 0,
    message: row.deviationMessage ?? '',
    instruction: row.deviationInstruction ?? '',
  };
}

export function presentEntry(
  row: RunTimelineEntryRow,
  users: ReadonlyMap<number, Pick<UserRow, 'id' | 'displayName'>>,
): TimelineEntry {
  const user = row.recordedById === null ? undefined : users.get(row.recordedById);
  return {
    id: row.id,
    clientId: row.clientId,
    kind: row.kind,
    at: row.at,
    stepIndex: row.stepIndex,
    temperatureC: row.temperatureC,
    text: row.text,
    uploadId: row.uploadId,
    photoUrl: row.uploadId === null ? null : photoUrl(row.runId, row.uploadId),
    durationMinutes: row.durationMinutes,
    endsAt: row.endsAt,
    timerClientId: row.timerClientId,
    deviation: deviationOfRow(row),
    recordedBy: user ? { id: user.id, displayName: user.displayName } : null,
    receivedAt: row.receivedAt,
  };
}

export function presentPhoto(row: RunPhotoRow): RunPhoto {
  return {
    uploadId: row.id,
    runId: row.runId,
    clientId: row.clientId,
    fileName: row.fileName,
    contentType: row.contentType,
    size: row.size,
    url: photoUrl(row.runId, row.id),
    uploadedAt: row.uploadedAt,
  };
}

/** The timer-start entries not stopped by a timer-end, soonest end first. */
export function runningTimersOf(rows: readonly RunTimelineEntryRow[]): RunTimelineEntryRow[] {
  const stopped = new Set(
    rows.flatMap((row) =>
      row.kind === 'timer-end' && row.timerClientId ? [row.timerClientId] : [],
    ),
  );
  return rows
    .filter((row) => row.kind === 'timer-start' && !stopped.has(row.clientId))
    .sort((a, b) => (a.endsAt ?? '').localeCompare(b.endsAt ?? '') || a.id - b.id);
}

function latestAt(rows: readonly RunTimelineEntryRow[], kind: string, stepIndex: number) {
  let found: string | null = null;
  for (const row of rows) {
    if (row.kind === kind && row.stepIndex === stepIndex && (found === null || row.at >= found)) {
      found = row.at;
    }
  }
  return found;
}

/**
 * A run's timeline from its rows (entries ordered by `at`, then id), its procedure and the
 * people who made the entries; reads nothing itself.
 */
export function presentTimeline(
  run: RunRow,
  procedure: LoadedProcedure,
  rows: readonly RunTimelineEntryRow[],
  users: ReadonlyMap<number, Pick<UserRow, 'id' | 'displayName'>>,
  now: string,
): RunTimeline {
  const steps: ProcedureStep[] = procedure.row.steps;
  const displays = scaledLineDisplays(procedure, run.scaleFactor);
  const entries = rows.map((row) => presentEntry(row, users));
  const byId = new Map(entries.map((entry) => [entry.id, entry]));
  const last = rows.at(-1)?.at;
  return {
    runId: run.id,
    status: run.status,
    steps: steps.map((step, index) => {
      const line = step.lineIndex === null ? undefined : procedure.lines[step.lineIndex];
      return {
        index,
        ...step,
        additionAmount: step.lineIndex === null ? null : (displays[step.lineIndex]?.text ?? null),
        additionChemical: line ? (procedure.chemicals.get(line.chemicalId)?.name ?? null) : null,
        windowText: temperatureWindowText(step),
        startedAt: latestAt(rows, 'step-start', index),
        endedAt: latestAt(rows, 'step-end', index),
      };
    }),
    entries,
    currentStepIndex: currentStepAt(
      rows.map(eventOf),
      last !== undefined && last > now ? last : now,
    ),
    runningTimers: runningTimersOf(rows).map((row) => byId.get(row.id)!),
    deviations: entries.flatMap((entry) =>
      entry.deviation ? [{ entryId: entry.id, at: entry.at, deviation: entry.deviation }] : [],
    ),
  };
}
