import { useEffect, useRef, useState, type FormEvent } from 'react';
import { formatMinutes } from '@lotwise/chem';
import { AlarmClock, Bell, BellOff, Square, Timer } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { parseDecimal } from '../../../lib/numbers';
import {
  askForNotifications,
  notificationState,
  notify,
  playAlarmSound,
  unlockAlarmSound,
  type NotificationState,
} from '../lib/alarm';
import type { BenchEntry } from '../lib/bench-state';
import { formatCountdown } from '../lib/bench-state';
import { formatClock } from '../lib/words';

/** "the timer of step 2 (30 min)", "a 10 min timer". */
export function timerName(timer: BenchEntry): string {
  const length = timer.durationMinutes !== null ? formatMinutes(timer.durationMinutes) : '';
  return timer.stepIndex !== null
    ? `the timer of step ${timer.stepIndex + 1} (${length})`
    : `a ${length} timer`;
}

function capitalised(text: string) {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** Rings (sound and notification) once for each timer that has run out while the page is open. */
export function useTimerAlarms(ended: readonly BenchEntry[]) {
  const rung = useRef(new Set<string>());
  useEffect(() => {
    const fresh = ended.filter((timer) => !rung.current.has(timer.clientId));
    if (fresh.length === 0) return;
    for (const timer of fresh) {
      rung.current.add(timer.clientId);
      notify('Lotwise: time is up', `${capitalised(timerName(timer))} has ended.`, timer.clientId);
    }
    playAlarmSound();
  }, [ended]);
}

/** The timers that ran out: on screen, announced, until the person stops them. */
export function TimerAlarms({
  ended,
  mayWrite,
  onStop,
}: {
  ended: readonly BenchEntry[];
  mayWrite: boolean;
  onStop: (timer: BenchEntry) => void;
}) {
  if (ended.length === 0) return null;
  return (
    <div
      role="alert"
      className="flex flex-col gap-2 rounded-lg border-2 border-danger-700 bg-danger-50 px-4 py-3 text-danger-700"
    >
      {ended.map((timer) => (
        <div key={timer.clientId} className="flex flex-wrap items-center justify-between gap-2">
          <p className="flex items-start gap-2 text-lg font-semibold">
            <AlarmClock aria-hidden="true" className="mt-1 size-5 shrink-0" />
            <span>
              Time is up: {timerName(timer)} ended at {formatClock(timer.endsAt!)}.
            </span>
          </p>
          {mayWrite && (
            <Button variant="danger" onClick={() => onStop(timer)}>
              Stop the alarm
            </Button>
          )}
        </div>
      ))}
    </div>
  );
}

/** Running timers, counting down to the end time the server holds. */
export function RunningTimers({
  timers,
  now,
  mayWrite,
  onStop,
}: {
  timers: readonly BenchEntry[];
  now: Date;
  mayWrite: boolean;
  onStop: (timer: BenchEntry) => void;
}) {
  if (timers.length === 0) return null;
  return (
    <ul aria-label="Running timers" className="flex flex-col gap-2">
      {timers.map((timer) => (
        <li
          key={timer.clientId}
          className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-accent-300 bg-white px-4 py-2"
        >
          <div>
            <p className="text-sm text-ink-700">
              {capitalised(timerName(timer))}, ends at {formatClock(timer.endsAt!)}
            </p>
            <p className="text-3xl font-semibold text-ink-900 tabular-nums" aria-label="Time left">
              {formatCountdown(Date.parse(timer.endsAt!) - now.getTime())}
            </p>
          </div>
          {mayWrite && (
            <Button
              icon={<Square aria-hidden="true" className="size-4" />}
              onClick={() => onStop(timer)}
            >
              Stop timer
            </Button>
          )}
        </li>
      ))}
    </ul>
  );
}

/** A timer of any length, for waits the procedure does not time. */
export function FreeTimerForm({ onStart }: { onStart: (minutes: number) => void }) {
  const [text, setText] = useState('');
  const [error, setError] = useState<string>();
  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const minutes = parseDecimal(text);
    if (minutes === null || Number.isNaN(minutes) || minutes <= 0 || minutes > 10080) {
      setError('Type the minutes, more than 0 and at most 10080 (a week).');
      return;
    }
    setError(undefined);
    setText('');
    unlockAlarmSound();
    onStart(minutes);
  };
  return (
    <form onSubmit={handleSubmit} noValidate className="flex flex-wrap items-end gap-2">
      <Field label="Timer (minutes)" error={error} className="w-36">
        {(control) => (
          <Input
            {...control}
            inputMode="decimal"
            autoComplete="off"
            value={text}
            onChange={(event) => setText(event.target.value)}
          />
        )}
      </Field>
      <Button type="submit" icon={<Timer aria-hidden="true" className="size-4" />}>
        Start timer
      </Button>
    </form>
  );
}

/** Asks for browser notifications, on a tap only; says plainly what the browser allows. */
export function NotifyButton() {
  const [state, setState] = useState<NotificationState>(notificationState);
  if (state === 'unsupported') {
    return (
      <p className="text-sm text-ink-600">
        This browser shows no notifications: keep the page open to see the alarm.
      </p>
    );
  }
  if (state === 'granted') {
    return (
      <p className="flex items-center gap-1.5 text-sm text-ink-700">
        <Bell aria-hidden="true" className="size-4" />
        You will be notified when a timer ends.
      </p>
    );
  }
  if (state === 'denied') {
    return (
      <p className="flex items-center gap-1.5 text-sm text-ink-700">
        <BellOff aria-hidden="true" className="size-4" />
        Notifications are blocked in this browser: the alarm shows on this page only.
      </p>
    );
  }
  return (
    <Button
      variant="ghost"
      icon={<Bell aria-hidden="true" className="size-4" />}
      onClick={() => {
        unlockAlarmSound();
        void askForNotifications().then(setState);
      }}
    >
      Notify me when a timer ends
    </Button>
  );
}
