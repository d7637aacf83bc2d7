import { currentStepAt, deviationOf } from '@lotwise/chem';
import {
  countOf,
  mayRecordRun,
  type ProcedureStep,
  type RunTimeline,
  type TimelineAppendResult,
  type TimelineEntryParsed,
  type User,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { isUniqueViolation, nowIso } from '../../db/sql';
import { loadProcedure } from '../procedures/procedures.service';
import type { RunRow } from '../runs/run.entity';
import { requireRun } from '../runs/run-views';
import type { RunTimelineEntryRow } from './run-timeline-entry.entity';
import type { TimelineEntryValues } from './run-timeline.repository';
import { eventOf, presentEntry, presentTimeline, runningTimersOf } from './timeline-view';

/** Most entries one run's timeline holds (a long day at the bench has a few hundred). */
export const maxTimelineEntries = 2000;

/**
 * Who may add to a run's timeline: whoever may record the run (`mayRecordRun`: its performer,
 * or a manager), 403 otherwise.
 */
export function requireMayAddTo(run: RunRow, actor: User) {
  if (!mayRecordRun(actor, { performerId: run.performedById })) {
    throw AppError.forbidden(
      `Run #${run.id} belongs to someone else: only the person running it or a manager can add to its timeline.`,
    );
  }
}

/** The entry checked against the run and its procedure, ready to insert. */
function entryValues(
  run: RunRow,
  steps: readonly ProcedureStep[],
  earlier: readonly RunTimelineEntryRow[],
  input: TimelineEntryParsed,
  photoOk: boolean,
  actor: User,
  receivedAt: string,
): TimelineEntryValues {
  const at = new Date(input.at).toISOString();
  const stepLabel = (index: number) => `step ${index + 1}`;
  if (input.stepIndex !== null && input.stepIndex >= steps.length) {
    const message =
      steps.length === 0
        ? 'the procedure of this run has no steps'
        : `the procedure of this run has ${countOf(steps.length, 'step')} (0 to ${steps.length - 1})`;
    throw AppError.validation(`There is no ${stepLabel(input.stepIndex)}: ${message}.`, {
      stepIndex: message,
    });
  }
  if (input.uploadId !== null && !photoOk) {
    const message = `is not a photo of run #${run.id}`;
    throw AppError.validation(`Photo #${input.uploadId} ${message}; upload it to this run first.`, {
      uploadId: message,
    });
  }
  const events = earlier.map(eventOf);
  let stepIndex = input.stepIndex;
  let durationMinutes: number | null = null;
  let endsAt: string | null = null;
  let timerClientId: string | null = null;

  if (input.kind === 'reading' && stepIndex === null) stepIndex = currentStepAt(events, at);
  if (input.kind === 'timer-start') {
    durationMinutes = input.durationMinutes ?? steps[stepIndex!]?.durationMinutes ?? null;
    if (durationMinutes === null) {
      const message = `${stepLabel(stepIndex!)} has no set time: give the timer a duration`;
      throw AppError.validation(`${message.charAt(0).toUpperCase()}${message.slice(1)}.`, {
        durationMinutes: message,
      });
    }
    endsAt = new Date(Date.parse(at) + durationMinutes * 60_000).toISOString();
  }
  if (input.kind === 'timer-end') {
    const timer = timerToStop(run, earlier, input);
    timerClientId = timer.clientId;
    stepIndex ??= timer.stepIndex;
  }

  const deviation = deviationOf(
    { kind: input.kind, at, stepIndex, temperatureC: input.temperatureC },
    events,
    steps,
  );
  return {
    runId: run.id,
    clientId: input.clientId,
    kind: input.kind,
    at,
    stepIndex,
    temperatureC: input.temperatureC,
    text: input.text,
    uploadId: input.uploadId,
    durationMinutes,
    endsAt,
    timerClientId,
    deviationReason: deviation?.reason ?? null,
    deviationStepIndex: deviation?.stepIndex ?? null,
    deviationMessage: deviation?.message ?? null,
    deviationInstruction: deviation
      ? deviation.reason === 'reading-outside-window'
        ? (steps[deviation.stepIndex]?.outsideWindow ?? '')
        : ''
      : null,
    recordedById: actor.id,
    receivedAt,
  };
}

/** The timer a timer-end stops: the one named, or the latest running one of its step. */
function timerToStop(
  run: RunRow,
  earlier: readonly RunTimelineEntryRow[],
  input: TimelineEntryParsed,
): RunTimelineEntryRow {
  if (input.timerClientId !== null) {
    const named = earlier.find(
      (row) => row.kind === 'timer-start' && row.clientId === input.timerClientId,
    );
    if (!named) {
      const message = `no timer of run #${run.id} was started with this client id`;
      throw AppError.validation(`Nothing to stop: ${message}.`, { timerClientId: message });
    }
    return named;
  }
  const running = runningTimersOf(earlier)
    .filter((row) => input.stepIndex === null || row.stepIndex === input.stepIndex)
    .sort((a, b) => a.at.localeCompare(b.at) || a.id - b.id);
  const latest = running.at(-1);
  if (!latest) {
    const where = input.stepIndex === null ? '' : ` for step ${input.stepIndex + 1}`;
    throw AppError.validation(`No timer is running${where} in run #${run.id}.`, {
      timerClientId: `no timer is running${where}`,
    });
  }
  return latest;
}

/** Appends inside the caller's transaction; answers the entry's id and whether it is new. */
async function appendWith(
  repos: Repositories,
  runId: number,
  input: TimelineEntryParsed,
  actor: User,
): Promise<{ id: number; created: boolean }> {
  // On PostgreSQL the run stays locked to the end of the transaction: appends take turns.
  const run = await requireRun(repos, runId);
  requireMayAddTo(run, actor);
  const found = await repos.runTimeline.entryByClientId(runId, input.clientId);
  if (found) return { id: found.id, created: false };
  const earlier = await repos.runTimeline.entriesOf(runId);
  if (earlier.length >= maxTimelineEntries) {
    throw AppError.conflict(
      `Run #${runId} already has ${maxTimelineEntries} timeline entries, the most one run keeps; note the rest in the run's notes.`,
    );
  }
  const procedure = await repos.procedures.findRow(run.procedureId);
  const photoOk =
    input.uploadId === null || (await repos.runTimeline.photoOf(runId, input.uploadId)) !== null;
  const values = entryValues(run, procedure?.steps ?? [], earlier, input, photoOk, actor, nowIso());
  return { id: await repos.runTimeline.insertEntry(values), created: true };
}

/**
 * A run's timeline: entries appended at the bench (idempotent by the device's client id,
 * flagged with the deviation they make) and the timeline read back with the procedure's
 * steps at the run's scale. Photos: run-photos.service.ts.
 */
export function runTimelineService(store: Store) {
  async function presentById(id: number) {
    const row = (await store.repos.runTimeline.entryById(id))!;
    const users = await store.repos.users.findByIds(
      row.recordedById === null ? [] : [row.recordedById],
    );
    return presentEntry(row, new Map(users.map((user) => [user.id, user])));
  }

  return {
    async append(
      runId: number,
      input: TimelineEntryParsed,
      actor: User,
    ): Promise<TimelineAppendResult> {
      let outcome: { id: number; created: boolean };
      try {
        outcome = await store.transaction((repos) => appendWith(repos, runId, input, actor));
      } catch (error) {
        // The same entry sent twice at the same moment: the other request stored it.
        if (!isUniqueViolation(error)) throw error;
        const found = await store.repos.runTimeline.entryByClientId(runId, input.clientId);
        if (!found) throw error;
        outcome = { id: found.id, created: false };
      }
      return { entry: await presentById(outcome.id), created: outcome.created };
    },

    async timeline(runId: number): Promise<RunTimeline> {
      const run = await requireRun(store.repos, runId);
      const procedure = await loadProcedure(store.repos, run.procedureId);
      const rows = await store.repos.runTimeline.entriesOf(runId);
      const userIds = [
        ...new Set(rows.flatMap((row) => (row.recordedById === null ? [] : [row.recordedById]))),
      ];
      const users = await store.repos.users.findByIds(userIds);
      return presentTimeline(
        run,
        procedure,
        rows,
        new Map(users.map((user) => [user.id, user])),
        nowIso(),
      );
    },
  };
}
export type RunTimelineService = ReturnType<typeof runTimelineService>;
