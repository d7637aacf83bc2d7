import 'fake-indexeddb/auto';
import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Run, RunTimeline, TimelineEntry } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const performer = makeUser({ role: 'member', displayName: 'Member One' });

function makeRun(id: number): Run {
  return {
    id,
    procedure: { id: 1, title: 'Diazotisation in the cold' },
    planId: null,
    scaleFactor: 1,
    status: 'open',
    performedBy: { id: performer.id, displayName: performer.displayName },
    performedOn: null,
    theoreticalYieldG: null,
    crudeMassG: null,
    productMassG: null,
    percentYield: null,
    crudePercentYield: null,
    expectedYieldPercent: null,
    yieldFlag: null,
    crudeYieldFlag: null,
    recordedAt: null,
    createdAt: '2026-12-03T08:00:00.000Z',
    deviationCount: 0,
    notes: '',
    draws: [],
    portions: [],
    stoichiometry: null,
    warnings: [],
    notices: [],
    observations: {
      meltingRangeC: null,
      literatureMeltingC: null,
      meltingComparison: null,
      appearance: '',
      notes: '',
    },
  };
}

const started: TimelineEntry = {
  id: 1,
  clientId: 'step-one-started',
  kind: 'step-start',
  // Started ten minutes ago, so a reading taken now comes after it.
  at: new Date(Date.now() - 10 * 60_000).toISOString(),
  stepIndex: 0,
  temperatureC: null,
  text: '',
  uploadId: null,
  photoUrl: null,
  durationMinutes: null,
  endsAt: null,
  timerClientId: null,
  deviation: null,
  recordedBy: { id: performer.id, displayName: performer.displayName },
  receivedAt: new Date(Date.now() - 10 * 60_000).toISOString(),
};

function makeTimeline(runId: number): RunTimeline {
  return {
    runId,
    status: 'open',
    steps: [
      {
        index: 0,
        text: 'Add the nitrite solution dropwise',
        durationMinutes: 20,
        temperatureLowC: 5,
        temperatureHighC: 7,
        outsideWindow: 'stop the addition until it is back in the window',
        lineIndex: 1,
        addition: 'dropwise over about 20 min',
        caution: 'exothermicAddition',
        holdPoint: '',
        additionAmount: '12.5 mL',
        additionChemical: 'Sodium nitrite solution',
        windowText: '5–7 °C',
        startedAt: started.at,
        endedAt: null,
      },
    ],
    entries: [started],
    currentStepIndex: 0,
    runningTimers: [],
    deviations: [],
  };
}

describe('Bench page', () => {
  it('when someone only follows the run, then the step and timeline show and nothing can be added', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/runs/21': { body: makeRun(21) },
      'GET /api/runs/21/timeline': { body: makeTimeline(21) },
    });
    renderApp('/preparations/runs/21/bench');

    expect(
      await screen.findByRole('heading', { name: 'Add the nitrite solution dropwise' }),
    ).toBeInTheDocument();
    expect(screen.getByText('Step 1 of 1')).toBeInTheDocument();
    expect(screen.getByText('5–7 °C')).toBeInTheDocument();
    expect(screen.getByText('12.5 mL')).toBeInTheDocument();
    expect(screen.getByText(/Exothermic: add slowly with cooling/)).toBeInTheDocument();
    expect(screen.getByText('You are following this run')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Add reading' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /End step/ })).not.toBeInTheDocument();
  });

  it('when the person running it adds a reading above the window, then it is flagged in words and sent', async () => {
    // The server as the page sees it: what was posted is in the timeline it answers next.
    const stored: TimelineEntry[] = [];
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: performer } },
      'GET /api/runs/22': { body: makeRun(22) },
      'GET /api/runs/22/timeline': () => ({
        body: { ...makeTimeline(22), entries: [started, ...stored] },
      }),
      'POST /api/runs/22/timeline': (request) => {
        const body = request.body as { clientId: string; at: string; temperatureC: number };
        const entry: TimelineEntry = {
          ...started,
          id: 2,
          clientId: body.clientId,
          kind: 'reading',
          at: body.at,
          temperatureC: body.temperatureC,
          stepIndex: 0,
          deviation: {
            reason: 'reading-outside-window',
            stepIndex: 0,
            message: '8.2 °C is 1.2 °C above the window of step 1 (5–7 °C)',
            instruction: 'stop the addition until it is back in the window',
          },
        };
        stored.push(entry);
        return { status: 201, body: { created: true, entry } };
      },
    });
    renderApp('/preparations/runs/22/bench');

    fireEvent.change(await screen.findByLabelText('Temperature (°C)'), {
      target: { value: '8,2' },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Add reading' }));

    // Written to IndexedDB first, then sent: slower than a plain request on a busy machine.
    expect(
      await screen.findByText('8.2 °C is outside the window', {}, { timeout: 10_000 }),
    ).toBeInTheDocument();
    const entries = screen.getByRole('list', { name: 'Timeline entries' });
    const reading = within(entries).getByText('Reading 8.2 °C (step 1)').closest('li')!;
    expect(reading).toHaveTextContent(
      'Outside the window: 8.2 °C is 1.2 °C above the window of step 1 (5–7 °C). The step says: stop the addition until it is back in the window',
    );
    await expect
      .poll(() => requests.filter((r) => r.method === 'POST').map((r) => r.body))
      .toEqual([expect.objectContaining({ kind: 'reading', temperatureC: 8.2 })]);
    expect(await screen.findByText('All entries sent')).toBeInTheDocument();
  });
});
