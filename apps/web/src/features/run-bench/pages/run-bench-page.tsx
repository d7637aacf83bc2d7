import { useMemo, useState } from 'react';
import { Link, useParams } from 'react-router';
import {
  mayRecordRun,
  type Procedure,
  type Run,
  type RunTimeline,
  type TimelineEntryInput,
} from '@lotwise/shared';
import { ChevronLeft } from 'lucide-react';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useCurrentUser } from '../../../lib/auth';
import { useBenchProcedure, useBenchRun, useRunTimeline } from '../api';
import { unlockAlarmSound } from '../lib/alarm';
import { benchState, type BenchEntry } from '../lib/bench-state';
import { newClientId } from '../lib/queue';
import { useBenchQueue } from '../lib/use-bench-queue';
import { useNow } from '../lib/use-now';
import { formatTemperature } from '../lib/words';
import { BenchHazardStrip, BenchHazards } from '../components/bench-hazards';
import { CurrentStep, type StepActions } from '../components/current-step';
import { QueueStatus } from '../components/queue-status';
import { QuickEntry, type QuickEntryActions } from '../components/quick-entry';
import { TimelineList } from '../components/timeline-list';
import {
  FreeTimerForm,
  NotifyButton,
  RunningTimers,
  TimerAlarms,
  useTimerAlarms,
} from '../components/timers';

type NewInput = Omit<TimelineEntryInput, 'clientId' | 'at'> & { at?: string };

/** The step to show: the one under way, else the one after the last step done, else the first. */
function stepToShow(state: ReturnType<typeof benchState>, count: number): number {
  if (state.currentStepIndex !== null) return state.currentStepIndex;
  const lastDone = state.stepTimes.findLastIndex((times) => times.endedAt !== null);
  return Math.min(Math.max(lastDone + 1, 0), count - 1);
}

/** What became of the last reading taken here: inside its window, or flagged with the step's words. */
function ReadingFeedback({ entry }: { entry: BenchEntry | undefined }) {
  if (!entry) return null;
  const value = formatTemperature(entry.temperatureC ?? 0);
  if (entry.deviation) {
    return (
      <Notice tone="danger" title={`${value} is outside the window`}>
        {entry.deviation.message}.
        {entry.deviation.instruction && ` The step says: ${entry.deviation.instruction}`}
      </Notice>
    );
  }
  return <Notice tone="ok" title={`${value} added to the timeline`} />;
}

function BenchView({
  run,
  procedure,
  timeline,
}: {
  run: Run;
  procedure: Procedure | undefined;
  timeline: RunTimeline;
}) {
  const now = useNow();
  const queue = useBenchQueue(run.id);
  const user = useCurrentUser().data;
  // The server's own rule: the person running it, or a manager.
  const mayWrite =
    !!user &&
    mayRecordRun(user, { performerId: run.performedBy?.id ?? null }) &&
    timeline.status === 'open';
  const [browsed, setBrowsed] = useState<number | null>(null);
  const [lastReading, setLastReading] = useState<string | null>(null);

  const state = useMemo(
    () => benchState(timeline, queue.items ?? [], now),
    [timeline, queue.items, now],
  );
  const steps = timeline.steps;
  const shown = steps.length === 0 ? null : (browsed ?? stepToShow(state, steps.length));
  const ended = state.runningTimers.filter((timer) => Date.parse(timer.endsAt!) <= now.getTime());
  const counting = state.runningTimers.filter((timer) => !ended.includes(timer));
  useTimerAlarms(ended);

  const add = async (input: NewInput, photo?: { file: File }) => {
    unlockAlarmSound();
    const clientId = newClientId();
    await queue.add({
      input: { ...input, clientId, at: input.at ?? new Date().toISOString() },
      photo: photo
        ? {
            clientId: `${clientId}-photo`,
            blob: photo.file,
            fileName: photo.file.name || 'photo.jpg',
          }
        : null,
    });
    return clientId;
  };
  const stopTimer = (timer: BenchEntry) =>
    void add({ kind: 'timer-end', stepIndex: timer.stepIndex, timerClientId: timer.clientId });

  const stepActions: StepActions = {
    start: (index) => {
      setBrowsed(null);
      void add({ kind: 'step-start', stepIndex: index });
    },
    end: (index) => {
      setBrowsed(null);
      void add({ kind: 'step-end', stepIndex: index });
    },
    startTimer: (index) => void add({ kind: 'timer-start', stepIndex: index }),
    browse: setBrowsed,
  };
  const entryActions: QuickEntryActions = {
    reading: async (temperatureC, at) => {
      setLastReading(await add({ kind: 'reading', temperatureC, at: at.toISOString() }));
    },
    note: async (text) => void (await add({ kind: 'note', text })),
    photo: async (file, caption) => void (await add({ kind: 'photo', text: caption }, { file })),
  };

  return (
    <div className="flex flex-col gap-4">
      <Link
        to={paths.run(run.id)}
        className="inline-flex items-center gap-1 self-start text-sm text-ink-600 hover:text-ink-900"
      >
        <ChevronLeft aria-hidden="true" className="size-4" />
        Run #{run.id}
      </Link>
      <header>
        <p className="text-sm text-ink-600">At the bench · run #{run.id}</p>
        <h1 className="text-xl font-semibold text-ink-900">{run.procedure.title}</h1>
      </header>
      {procedure && <BenchHazardStrip procedure={procedure} />}

      <TimerAlarms ended={ended} mayWrite={mayWrite} onStop={stopTimer} />
      {queue.items !== null && (
        <QueueStatus
          waiting={state.waitingCount}
          refused={state.refused.length}
          online={queue.online}
          sending={queue.sending}
          problem={queue.lastProblem}
        />
      )}
      {timeline.status === 'recorded' && (
        <Notice title="This run is recorded">
          Its timeline is closed: it can be read here and in the run&apos;s record.
        </Notice>
      )}
      {timeline.status === 'open' && !mayWrite && (
        <Notice title="You are following this run">
          The timeline refreshes by itself. Only the person running it, or a manager, can add to it.
        </Notice>
      )}

      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="flex flex-col gap-4">
          {shown === null ? (
            <Notice title="This procedure has no steps written">
              Readings, observations and photos can still be added. Steps are written in the
              procedure&apos;s form.
            </Notice>
          ) : (
            <CurrentStep
              steps={steps}
              index={shown}
              currentIndex={state.currentStepIndex}
              times={state.stepTimes[shown]!}
              timerRunning={state.runningTimers.some((timer) => timer.stepIndex === shown)}
              mayWrite={mayWrite}
              actions={stepActions}
            />
          )}
          <RunningTimers timers={counting} now={now} mayWrite={mayWrite} onStop={stopTimer} />
          {mayWrite && (
            <>
              <QuickEntry
                actions={entryActions}
                readingFeedback={
                  <ReadingFeedback
                    entry={state.entries.find((entry) => entry.clientId === lastReading)}
                  />
                }
              />
              <section
                aria-labelledby="bench-timers-heading"
                className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
              >
                <h2 id="bench-timers-heading" className="text-base font-semibold">
                  Timers
                </h2>
                <FreeTimerForm
                  onStart={(minutes) =>
                    void add({
                      kind: 'timer-start',
                      durationMinutes: minutes,
                      stepIndex: state.currentStepIndex,
                    })
                  }
                />
                <p className="text-sm text-ink-600">
                  A timer keeps its end time on the server: it still rings when you come back to
                  this page after closing it.
                </p>
                <NotifyButton />
              </section>
            </>
          )}
        </div>
        <div className="flex flex-col gap-4">
          <TimelineList
            entries={state.entries}
            onDiscard={(entry) => entry.queued && void queue.discard(entry.queued)}
          />
          {procedure && <BenchHazards procedure={procedure} />}
        </div>
      </div>
    </div>
  );
}

export function RunBenchPage() {
  const id = Number(useParams().id);
  const run = useBenchRun(id);
  const timeline = useRunTimeline(id);
  const procedure = useBenchProcedure(run.data?.procedure.id);
  const failed = run.error ?? timeline.error;
  if (failed && !(run.data && timeline.data)) {
    return (
      <ErrorState
        title="The run's timeline could not be loaded"
        error={failed}
        onRetry={() => {
          void run.refetch();
          void timeline.refetch();
        }}
      />
    );
  }
  if (!run.data || !timeline.data) return <PageSpinner label="Loading the run…" />;
  return <BenchView run={run.data} procedure={procedure.data} timeline={timeline.data} />;
}
