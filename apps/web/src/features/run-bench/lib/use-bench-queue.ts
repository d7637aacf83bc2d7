import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { RunTimeline, TimelineEntry } from '@lotwise/shared';
import { benchKeys } from '../api';
import {
  discard,
  enqueue,
  flushQueue,
  queuedEntries,
  subscribeQueue,
  type NewQueuedEntry,
  type QueuedEntry,
} from './queue';

/** Waits between tries while the server cannot be reached: 2 s, 4 s, 8 s … at most a minute. */
export function retryDelayMs(failures: number): number {
  return Math.min(60_000, 2_000 * 2 ** Math.max(0, failures - 1));
}

function isOnline() {
  return typeof navigator === 'undefined' ? true : navigator.onLine;
}

export interface BenchQueue {
  /** The run's entries on this device (waiting or refused), oldest first; null while read. */
  items: QueuedEntry[] | null;
  online: boolean;
  /** True while entries are being sent. */
  sending: boolean;
  /** Why the last try did not get through (network trouble), until one does. */
  lastProblem: string | null;
  add: (entry: NewQueuedEntry) => Promise<void>;
  discard: (entry: QueuedEntry) => Promise<void>;
}

/**
 * The run's outbox for a page: read from IndexedDB, sent whenever the device is online
 * (on opening, on each new entry, on the browser's `online` event, and again with a growing
 * wait after a failed try). Each stored entry goes into the cached timeline at once.
 */
export function useBenchQueue(runId: number): BenchQueue {
  const queryClient = useQueryClient();
  const [items, setItems] = useState<QueuedEntry[] | null>(null);
  const [online, setOnline] = useState(isOnline);
  const [sending, setSending] = useState(false);
  const [lastProblem, setLastProblem] = useState<string | null>(null);
  const failures = useRef(0);
  const retryTimer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  // The latest `send`, for the tries it schedules after itself.
  const sendAgain = useRef<() => void>(() => {});

  const onSent = useCallback(
    (entry: TimelineEntry) => {
      queryClient.setQueryData<RunTimeline>(benchKeys.timeline(runId), (old) => {
        if (!old || old.entries.some((known) => known.clientId === entry.clientId)) return old;
        const entries = [...old.entries, entry].sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
        return { ...old, entries };
      });
    },
    [queryClient, runId],
  );

  const send = useCallback(async () => {
    clearTimeout(retryTimer.current);
    if (!isOnline()) return;
    setSending(true);
    const outcome = await flushQueue(runId, onSent).catch((error: unknown) => ({
      kind: 'retry' as const,
      message: error instanceof Error ? error.message : String(error),
    }));
    setSending(false);
    if (outcome.kind === 'done') {
      failures.current = 0;
      setLastProblem(null);
      void queryClient.invalidateQueries({ queryKey: benchKeys.timeline(runId) });
      // An entry taken just as the last send finished: send it now rather than at the next one.
      const left = await queuedEntries(runId);
      if (left.some((entry) => entry.state === 'waiting')) {
        retryTimer.current = setTimeout(() => sendAgain.current(), 0);
      }
      return;
    }
    failures.current += 1;
    setLastProblem(outcome.message);
    retryTimer.current = setTimeout(() => sendAgain.current(), retryDelayMs(failures.current));
  }, [onSent, queryClient, runId]);

  useEffect(() => {
    sendAgain.current = () => void send();
  }, [send]);

  useEffect(() => {
    let live = true;
    const read = () =>
      void queuedEntries(runId).then((list) => {
        if (live) setItems(list);
      });
    read();
    const unsubscribe = subscribeQueue(runId, read);
    // What waits from an earlier visit goes as soon as the page is open.
    retryTimer.current = setTimeout(() => void send(), 0);
    const handleOnline = () => {
      setOnline(true);
      failures.current = 0;
      void send();
    };
    const handleOffline = () => setOnline(false);
    window.addEventListener('online', handleOnline);
    window.addEventListener('offline', handleOffline);
    return () => {
      live = false;
      unsubscribe();
      clearTimeout(retryTimer.current);
      window.removeEventListener('online', handleOnline);
      window.removeEventListener('offline', handleOffline);
    };
  }, [runId, send]);

  return {
    items,
    online,
    sending,
    lastProblem,
    add: async (entry) => {
      await enqueue(runId, entry);
      void send();
    },
    discard,
  };
}
