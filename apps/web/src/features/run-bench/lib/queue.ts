import { createStore, del, entries, set, type UseStore } from 'idb-keyval';
import type { TimelineEntry, TimelineEntryInput } from '@lotwise/shared';
import { isApiError } from '../../../lib/api-client';
import { postRunPhoto, postTimelineEntry } from '../api';

/**
 * The bench's outbox: every entry taken at the bench is first written to IndexedDB on this
 * device, then sent to the server in the order it was taken, one at a time. An entry leaves
 * the outbox only once the server has stored it (or the person discards a refused one), so
 * a dropped connection or a closed page loses nothing; each entry carries its own client id,
 * so sending it twice stores it once.
 */

/** An entry as it waits on the device. `input.at` is when it was taken, not when it is sent. */
export interface QueuedEntry {
  /** `[runId, seq]`: IndexedDB orders the keys, and so the entries, run by run. */
  key: [number, number];
  runId: number;
  input: TimelineEntryInput & { clientId: string; at: string };
  /** A photo not yet uploaded; dropped once the server holds it (`input.uploadId` set). */
  photo: { clientId: string; blob: Blob; fileName: string } | null;
  /** `refused`: the server said no (a 4xx other than 408/429); kept until discarded. */
  state: 'waiting' | 'refused';
  /** The server's reason when refused. */
  message: string;
}

export type NewQueuedEntry = Pick<QueuedEntry, 'input' | 'photo'>;

let store: UseStore | undefined;
function outbox(): UseStore {
  store ??= createStore('lotwise-bench', 'outbox');
  return store;
}

let lastSeq = 0;
/** Increasing across calls and across reloads (milliseconds, then a counter). */
function nextSeq(): number {
  lastSeq = Math.max(lastSeq + 1, Date.now() * 1000);
  return lastSeq;
}

/** A client id for an entry: a random UUID. */
export function newClientId(): string {
  return crypto.randomUUID();
}

type Listener = () => void;
const listeners = new Map<number, Set<Listener>>();

/** Calls `listener` whenever the run's outbox changes; returns the unsubscribe. */
export function subscribeQueue(runId: number, listener: Listener): () => void {
  const group = listeners.get(runId) ?? new Set<Listener>();
  group.add(listener);
  listeners.set(runId, group);
  return () => group.delete(listener);
}

function changed(runId: number) {
  for (const listener of listeners.get(runId) ?? []) listener();
}

/** The run's entries on this device, oldest first. */
export async function queuedEntries(runId: number): Promise<QueuedEntry[]> {
  const all = await entries<[number, number], QueuedEntry>(outbox());
  return all
    .map(([, entry]) => entry)
    .filter((entry) => entry.runId === runId)
    .sort((a, b) => a.key[1] - b.key[1]);
}

/** Writes an entry to the device's outbox (before anything is sent). */
export async function enqueue(runId: number, entry: NewQueuedEntry): Promise<QueuedEntry> {
  const queued: QueuedEntry = {
    key: [runId, nextSeq()],
    runId,
    input: entry.input,
    photo: entry.photo,
    state: 'waiting',
    message: '',
  };
  await set(queued.key, queued, outbox());
  changed(runId);
  return queued;
}

/** Drops a refused entry the person chose to discard. */
export async function discard(entry: QueuedEntry): Promise<void> {
  await del(entry.key, outbox());
  changed(entry.runId);
}

/** Whether an error means "try again later" rather than "the server refused this entry". */
export function isRetryable(error: unknown): boolean {
  if (!isApiError(error)) return true;
  if (error.status === 408 || error.status === 429) return true;
  return !(error.status >= 400 && error.status < 500);
}

export type FlushOutcome =
  /** Nothing waits (refused entries may remain, they are not sent again). */
  | { kind: 'done' }
  /** The server could not be reached or asked to wait: try again later. */
  | { kind: 'retry'; message: string };

const flushing = new Map<number, Promise<FlushOutcome>>();

/**
 * Sends the run's waiting entries in order, one at a time, and removes each once stored.
 * A refusal marks that entry and goes on with the next; a network error stops, answering
 * `retry`. Only one send runs per run at a time (a second call joins the first).
 */
export function flushQueue(
  runId: number,
  onSent: (entry: TimelineEntry) => void = () => {},
): Promise<FlushOutcome> {
  const running = flushing.get(runId);
  if (running) return running;
  const run = sendAll(runId, onSent).finally(() => flushing.delete(runId));
  flushing.set(runId, run);
  return run;
}

async function sendAll(
  runId: number,
  onSent: (entry: TimelineEntry) => void,
): Promise<FlushOutcome> {
  for (;;) {
    const next = (await queuedEntries(runId)).find((entry) => entry.state === 'waiting');
    if (!next) return { kind: 'done' };
    try {
      const sent = await sendOne(next);
      await del(next.key, outbox());
      changed(runId);
      onSent(sent);
    } catch (error) {
      if (isRetryable(error)) {
        return { kind: 'retry', message: error instanceof Error ? error.message : String(error) };
      }
      const message = error instanceof Error ? error.message : 'The server refused the entry.';
      await set(next.key, { ...next, state: 'refused', message }, outbox());
      changed(runId);
    }
  }
}

async function sendOne(entry: QueuedEntry): Promise<TimelineEntry> {
  let input = entry.input;
  if (entry.photo) {
    const photo = await postRunPhoto(
      entry.runId,
      entry.photo.clientId,
      entry.photo.blob,
      entry.photo.fileName,
    );
    input = { ...input, uploadId: photo.uploadId };
    // The server holds the photo now: keep only its id, so a retry does not upload it again.
    await set(entry.key, { ...entry, input, photo: null }, outbox());
  }
  const { entry: stored } = await postTimelineEntry(entry.runId, input);
  return stored;
}
