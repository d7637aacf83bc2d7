import { useEffect, useMemo } from 'react';
import { formatMinutes } from '@lotwise/chem';
import { CloudOff, TriangleAlert } from 'lucide-react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import type { BenchEntry } from '../lib/bench-state';
import { formatClock, formatTemperature } from '../lib/words';

function stepWords(entry: BenchEntry) {
  return entry.stepIndex === null ? '' : `step ${entry.stepIndex + 1}`;
}

/** What the entry says, in a line. */
function entryWords(entry: BenchEntry): string {
  const step = stepWords(entry);
  switch (entry.kind) {
    case 'reading':
      return `Reading ${formatTemperature(entry.temperatureC ?? 0)}${step ? ` (${step})` : ''}`;
    case 'note':
      return entry.text;
    case 'photo':
      return entry.text ? `Photo: ${entry.text}` : 'Photo';
    case 'step-start':
      return `Started ${step}`;
    case 'step-end':
      return `Ended ${step}`;
    case 'timer-start':
      return `Timer started${entry.durationMinutes !== null ? `: ${formatMinutes(entry.durationMinutes)}` : ''}${step ? ` (${step})` : ''}`;
    case 'timer-end':
      return `Timer stopped${step ? ` (${step})` : ''}`;
  }
}

function PhotoThumb({ entry }: { entry: BenchEntry }) {
  const blob = entry.photoBlob;
  const local = useMemo(() => (blob ? URL.createObjectURL(blob) : null), [blob]);
  useEffect(() => {
    if (local) return () => URL.revokeObjectURL(local);
  }, [local]);
  const src = entry.photoUrl ?? local;
  if (!src) return null;
  return (
    <img
      src={src}
      alt={entry.text ? `Photo: ${entry.text}` : `Photo taken at ${formatClock(entry.at)}`}
      className="mt-1 max-h-40 max-w-full rounded-md border border-ink-200"
    />
  );
}

/** The run's timeline, newest first, with what waits on this device marked as such. */
export function TimelineList({
  entries,
  onDiscard,
}: {
  entries: readonly BenchEntry[];
  onDiscard: (entry: BenchEntry) => void;
}) {
  return (
    <section
      aria-labelledby="bench-timeline-heading"
      className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2 id="bench-timeline-heading" className="text-base font-semibold">
        Timeline <span className="font-normal text-ink-600">(newest first)</span>
      </h2>
      {entries.length === 0 ? (
        <p className="text-sm text-ink-600">Nothing recorded yet: start the first step.</p>
      ) : (
        <ol aria-label="Timeline entries" className="flex flex-col">
          {[...entries].reverse().map((entry) => (
            <li
              key={entry.clientId}
              data-testid="timeline-entry"
              className="flex gap-3 border-b border-ink-100 py-2 last:border-0"
            >
              <time
                dateTime={entry.at}
                className="w-16 shrink-0 pt-0.5 text-sm whitespace-nowrap text-ink-600 tabular-nums"
              >
                {formatClock(entry.at)}
              </time>
              <div className="min-w-0 flex-1">
                <p
                  className={
                    entry.kind === 'note'
                      ? 'whitespace-pre-line text-ink-900'
                      : 'font-medium text-ink-900'
                  }
                >
                  {entry.kind === 'note' && <span className="sr-only">Observation: </span>}
                  {entryWords(entry)}
                </p>
                {entry.deviation && (
                  <p className="mt-1 flex items-start gap-1.5 text-sm font-medium text-danger-700">
                    <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
                    <span>
                      {entry.deviation.reason === 'reading-outside-window'
                        ? 'Outside the window'
                        : 'Deviation'}
                      : {entry.deviation.message}.
                      {entry.deviation.instruction &&
                        ` The step says: ${entry.deviation.instruction}`}
                    </span>
                  </p>
                )}
                {entry.kind === 'photo' && <PhotoThumb entry={entry} />}
                <p className="mt-0.5 flex flex-wrap items-center gap-2 text-xs text-ink-600">
                  {entry.recordedBy && <span>{entry.recordedBy}</span>}
                  {entry.sync === 'waiting' && (
                    <Badge tone="warn">
                      <CloudOff aria-hidden="true" className="size-3" />
                      waiting to be sent
                    </Badge>
                  )}
                </p>
                {entry.sync === 'refused' && (
                  <div className="mt-1 flex flex-wrap items-center gap-2 text-sm text-danger-700">
                    <span>Refused: {entry.message}</span>
                    <Button size="sm" variant="secondary" onClick={() => onDiscard(entry)}>
                      Discard this entry
                    </Button>
                  </div>
                )}
              </div>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
