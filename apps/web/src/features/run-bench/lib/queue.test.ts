// @vitest-environment node
// (Node's own Blob and FormData: IndexedDB clones a photo as the browser does; jsdom's Blob cannot be cloned by fake-indexeddb.)
import 'fake-indexeddb/auto';
import { describe, expect, it, vi } from 'vitest';
import type { TimelineEntry } from '@lotwise/shared';
import { mockFetch, type RecordedRequest } from '../../../test/fetch-mock';
import { discard, enqueue, flushQueue, newClientId, queuedEntries } from './queue';

/** What the server answers for a stored entry (the fields the bench reads). */
function storedEntry(body: Record<string, unknown>, id: number): TimelineEntry {
  return {
    id,
    clientId: String(body.clientId),
    kind: body.kind as TimelineEntry['kind'],
    at: String(body.at),
    stepIndex: (body.stepIndex as number | undefined) ?? null,
    temperatureC: (body.temperatureC as number | undefined) ?? null,
    text: (body.text as string | undefined) ?? '',
    uploadId: (body.uploadId as number | undefined) ?? null,
    photoUrl: null,
    durationMinutes: null,
    endsAt: null,
    timerClientId: null,
    deviation: null,
    recordedBy: { id: 3, displayName: 'Member One' },
    receivedAt: '2026-12-03T09:00:00.000Z',
  };
}

/** A server that stores each client id once, as the real one does. */
function fakeServer(runId: number) {
  const stored = new Map<string, TimelineEntry>();
  const answer = (request: RecordedRequest) => {
    const body = request.body as Record<string, unknown>;
    const known = stored.get(String(body.clientId));
    if (known) return { status: 200, body: { entry: known, created: false } };
    const entry = storedEntry(body, stored.size + 1);
    stored.set(entry.clientId, entry);
    return { status: 201, body: { entry, created: true } };
  };
  return { stored, route: `POST /api/runs/${runId}/timeline`, answer };
}

function reading(temperatureC: number, at: string) {
  return {
    input: { clientId: newClientId(), kind: 'reading' as const, at, temperatureC, stepIndex: 0 },
    photo: null,
  };
}

describe('the bench outbox', () => {
  it('when three readings are queued, then they are sent in the order taken, one at a time', async () => {
    const server = fakeServer(11);
    const { requests } = mockFetch({ [server.route]: server.answer });
    await enqueue(11, reading(6.1, '2026-12-03T09:00:00Z'));
    await enqueue(11, reading(6.4, '2026-12-03T09:01:00Z'));
    await enqueue(11, reading(7.9, '2026-12-03T09:02:00Z'));
    expect(await queuedEntries(11)).toHaveLength(3);

    const sent: TimelineEntry[] = [];
    expect(await flushQueue(11, (entry) => sent.push(entry))).toEqual({ kind: 'done' });

    expect(requests.map((r) => (r.body as { temperatureC: number }).temperatureC)).toEqual([
      6.1, 6.4, 7.9,
    ]);
    expect(sent.map((entry) => entry.temperatureC)).toEqual([6.1, 6.4, 7.9]);
    expect(server.stored.size).toBe(3);
    expect(await queuedEntries(11)).toEqual([]);
  });

  it('when the connection drops mid-way, then what was not stored waits and is sent later, once', async () => {
    const server = fakeServer(12);
    let online = true;
    const { fetchMock } = mockFetch({ [server.route]: server.answer });
    const answerOnline = fetchMock.getMockImplementation()!;
    fetchMock.mockImplementation(async (...args) => {
      if (!online) throw new TypeError('Failed to fetch');
      const response = await answerOnline(...args);
      // The server stored the first entry, but its answer was lost on the way back.
      online = false;
      throw new TypeError(`Failed to fetch (answer ${response.status} lost)`);
    });
    await enqueue(12, reading(5.5, '2026-12-03T09:00:00Z'));
    await enqueue(12, reading(5.8, '2026-12-03T09:01:00Z'));

    const outcome = await flushQueue(12);
    expect(outcome.kind).toBe('retry');
    expect(server.stored.size).toBe(1);
    expect(await queuedEntries(12)).toHaveLength(2);

    fetchMock.mockImplementation(answerOnline);
    expect(await flushQueue(12)).toEqual({ kind: 'done' });
    // The first entry went twice; the server answered the stored one and stored nothing new.
    expect(fetchMock).toHaveBeenCalledTimes(3);
    expect(server.stored.size).toBe(2);
    expect(await queuedEntries(12)).toEqual([]);
  });

  it('when the server refuses an entry, then it is kept with the reason and the next ones still go', async () => {
    const server = fakeServer(13);
    mockFetch({
      [server.route]: (request) => {
        const body = request.body as { temperatureC: number };
        if (body.temperatureC > 900) {
          return {
            status: 422,
            body: {
              error: { code: 'validation_failed', message: 'The run is recorded: no new entries.' },
            },
          };
        }
        return server.answer(request);
      },
    });
    await enqueue(13, reading(950, '2026-12-03T09:00:00Z'));
    await enqueue(13, reading(6, '2026-12-03T09:01:00Z'));

    expect(await flushQueue(13)).toEqual({ kind: 'done' });
    const left = await queuedEntries(13);
    expect(left).toHaveLength(1);
    expect(left[0]).toMatchObject({
      state: 'refused',
      message: 'The run is recorded: no new entries.',
    });
    expect(server.stored.size).toBe(1);

    // A refused entry is not sent again by itself, and leaves only when discarded.
    await flushQueue(13);
    expect(await queuedEntries(13)).toHaveLength(1);
    await discard(left[0]!);
    expect(await queuedEntries(13)).toEqual([]);
  });

  it('when the server asks to wait (429) or fails (503), then the entry waits rather than being refused', async () => {
    let status = 429;
    mockFetch({
      'POST /api/runs/14/timeline': () => ({
        status,
        body: { error: { code: 'rate_limited', message: 'Too many requests' } },
      }),
    });
    await enqueue(14, reading(6, '2026-12-03T09:00:00Z'));
    expect((await flushQueue(14)).kind).toBe('retry');
    status = 503;
    expect((await flushQueue(14)).kind).toBe('retry');
    expect(await queuedEntries(14)).toMatchObject([{ state: 'waiting' }]);
  });

  it('when the page is loaded again, then the entries are still on the device, per run', async () => {
    mockFetch({});
    await enqueue(15, reading(6, '2026-12-03T09:00:00Z'));
    await enqueue(16, reading(7, '2026-12-03T09:00:00Z'));
    vi.resetModules();
    const fresh = await import('./queue');
    expect((await fresh.queuedEntries(15)).map((e) => e.input.temperatureC)).toEqual([6]);
    expect((await fresh.queuedEntries(16)).map((e) => e.input.temperatureC)).toEqual([7]);
  });

  it('when a photo waits, then it is uploaded first and its entry names the stored upload', async () => {
    const server = fakeServer(17);
    const { requests } = mockFetch({
      'POST /api/runs/17/photos': (request) => ({
        status: 201,
        body: {
          uploadId: 41,
          runId: 17,
          clientId: (request.body as { clientId: string }).clientId,
          fileName: 'bench.jpg',
          contentType: 'image/jpeg',
          size: 4,
          url: '/api/runs/17/photos/41',
          uploadedAt: '2026-12-03T09:00:00.000Z',
        },
      }),
      [server.route]: server.answer,
    });
    const clientId = newClientId();
    await enqueue(17, {
      input: { clientId, kind: 'photo', at: '2026-12-03T09:00:00Z', text: 'colour change' },
      photo: {
        clientId: `${clientId}-photo`,
        blob: new Blob(['jpeg'], { type: 'image/jpeg' }),
        fileName: 'bench.jpg',
      },
    });
    expect(await flushQueue(17)).toEqual({ kind: 'done' });
    expect(requests.map((r) => `${r.method} ${r.url.pathname}`)).toEqual([
      'POST /api/runs/17/photos',
      'POST /api/runs/17/timeline',
    ]);
    expect(requests[0]!.body).toEqual({ clientId: `${clientId}-photo`, file: 'bench.jpg' });
    expect(requests[1]!.body).toMatchObject({ kind: 'photo', uploadId: 41 });
  });
});
