import { expect, test, type APIRequestContext } from '@playwright/test';
import { paths } from '../apps/web/src/config/paths';
import { demo, signIn } from './support';

/**
 * A run followed at the bench on a phone: a step timer that rings when its time is up, a
 * reading outside the step's window flagged on entry, and readings taken while offline that
 * reach the server exactly once when the connection returns.
 */

interface LineView {
  chemicalId: number;
  role: string;
  quantity: number | null;
  unit: string | null;
  coefficient: number | null;
  optional: boolean;
  notes: string;
  concentration: unknown;
  solutionDensity: number | null;
  dissolvedIn: { chemicalId: number; quantity: number; unit: string } | null;
}

/** A procedure of its own (a demo procedure's lines, with two steps), made by the manager. */
async function makeProcedure(api: APIRequestContext): Promise<number> {
  const login = await api.post('/api/auth/login', {
    data: { email: demo.manager, password: demo.password },
  });
  expect(login.ok()).toBe(true);
  const list = (await (await api.get('/api/procedures')).json()) as { items: { id: number }[] };
  const source = (await (await api.get(`/api/procedures/${list.items[0]!.id}`)).json()) as {
    lines: LineView[];
  };
  const lines = source.lines.map((line) => ({
    chemicalId: line.chemicalId,
    role: line.role,
    quantity: line.quantity,
    unit: line.unit,
    coefficient: line.coefficient,
    optional: line.optional,
    notes: line.notes,
    concentration: line.concentration,
    solutionDensity: line.solutionDensity,
    dissolvedIn: line.dissolvedIn && {
      chemicalId: line.dissolvedIn.chemicalId,
      quantity: line.dissolvedIn.quantity,
      unit: line.dissolvedIn.unit,
    },
  }));
  const created = await api.post('/api/procedures', {
    data: {
      title: `Bench check ${Date.now()}`,
      lines,
      steps: [
        {
          text: 'Stir the mixture in the ice bath',
          durationMinutes: 30,
          temperatureLowC: 5,
          temperatureHighC: 7,
          outsideWindow: 'add ice to the bath and wait before going on',
        },
        { text: 'Let it stand at room temperature', durationMinutes: 240 },
      ],
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  return ((await created.json()) as { id: number }).id;
}

interface StoredTimeline {
  entries: { kind: string; clientId: string; temperatureC: number | null }[];
}

test('at the bench: a timer rings, a reading outside the window is flagged, entries taken offline arrive once', async ({
  page,
  context,
  playwright,
  baseURL,
}) => {
  // Many steps through a phone-sized page, on a machine that may be busy.
  test.setTimeout(120_000);
  const manager = await playwright.request.newContext({ baseURL });
  const procedureId = await makeProcedure(manager);
  await manager.dispose();

  await page.clock.install();
  await signIn(page, demo.member);
  await page.setViewportSize({ width: 390, height: 844 });
  const run = await page.request.post('/api/runs', { data: { procedureId } });
  expect(run.status()).toBe(201);
  const runId = ((await run.json()) as { id: number }).id;

  await page.goto(paths.run(runId));
  await page.getByRole('link', { name: 'Follow the steps at the bench' }).click();
  await expect(
    page.getByRole('heading', { name: 'Stir the mixture in the ice bath' }),
  ).toBeVisible();
  await expect(page.getByText('Step 1 of 2')).toBeVisible();
  await expect(page.getByText('Keep at 5–7 °C')).toBeVisible();

  // A 30-minute step timer, run out by the page's clock.
  await page.getByRole('button', { name: 'Start step 1' }).click();
  await page.getByRole('button', { name: 'Start timer (30 min)' }).click();
  const timers = page.getByRole('list', { name: 'Running timers' });
  await expect(timers).toContainText('The timer of step 1 (30 min)');
  await expect(page.getByTestId('queue-status')).toHaveText('All entries sent');
  await page.clock.fastForward('30:00');
  const alarm = page.getByRole('alert').filter({ hasText: 'Time is up' });
  await expect(alarm).toBeVisible();
  await expect(alarm).toContainText('the timer of step 1 (30 min) ended');
  await alarm.getByRole('button', { name: 'Stop the alarm' }).click();
  await expect(alarm).toBeHidden();

  // A reading above the window, typed with a decimal comma.
  await page.getByLabel('Temperature (°C)').fill('9,5');
  await page.getByRole('button', { name: 'Add reading' }).click();
  await expect(page.getByText('9.5 °C is outside the window')).toBeVisible();
  const flagged = page.getByTestId('timeline-entry').filter({ hasText: 'Reading 9.5 °C' });
  await expect(flagged).toContainText(
    'Outside the window: 9.5 °C is 2.5 °C above the window of step 1 (5–7 °C).',
  );
  await expect(flagged).toContainText(
    'The step says: add ice to the bath and wait before going on',
  );
  await expect(page.getByTestId('queue-status')).toHaveText('All entries sent');

  // Three readings while the connection is down.
  await context.setOffline(true);
  for (const value of ['6.1', '6.4', '6.8']) {
    await page.getByLabel('Temperature (°C)').fill(value);
    await page.getByRole('button', { name: 'Add reading' }).click();
    await expect(
      page.getByTestId('timeline-entry').filter({ hasText: `Reading ${value} °C` }),
    ).toContainText('waiting to be sent');
  }
  await expect(page.getByTestId('queue-status')).toHaveText('3 entries wait to be sent (offline)');
  await context.setOffline(false);
  await expect(page.getByTestId('queue-status')).toHaveText('All entries sent');

  const stored = async () => {
    const answer = await page.request.get(`/api/runs/${runId}/timeline`);
    expect(answer.ok()).toBe(true);
    const { entries } = (await answer.json()) as StoredTimeline;
    return entries.filter((entry) => entry.kind === 'reading').map((entry) => entry.temperatureC);
  };
  expect(await stored()).toEqual([9.5, 6.1, 6.4, 6.8]);

  // A photo from the device's camera (here a file), uploaded and then added to the timeline.
  await page.getByLabel('Photo', { exact: true }).setInputFiles({
    name: 'bench.png',
    mimeType: 'image/png',
    buffer: Buffer.from(
      'iVBORw0KGgoAAAANSUhEUgAAAAIAAAACCAIAAAD91JpzAAAAFklEQVR4nGP4z8DAwMDAxMDAwMDAAAANHQEDasKb6QAAAABJRU5ErkJggg==',
      'base64',
    ),
  });
  await page.getByLabel('Caption').fill('Colour after the addition');
  await page.getByRole('button', { name: 'Add photo' }).click();
  await expect(page.getByRole('img', { name: 'Photo: Colour after the addition' })).toBeVisible();
  await expect(page.getByTestId('queue-status')).toHaveText('All entries sent');
  const photos = (
    (await (await page.request.get(`/api/runs/${runId}/timeline`)).json()) as {
      entries: { kind: string; photoUrl: string | null }[];
    }
  ).entries.filter((entry) => entry.kind === 'photo');
  expect(photos).toHaveLength(1);
  expect((await page.request.get(photos[0]!.photoUrl!)).headers()['content-type']).toBe(
    'image/png',
  );

  // Opened again: nothing waits on the device, nothing is sent twice.
  await page.reload();
  await expect(page.getByTestId('queue-status')).toHaveText('All entries sent');
  await expect(
    page.getByTestId('timeline-entry').filter({ hasText: 'Reading 6.4 °C' }),
  ).toHaveCount(1);
  expect(await stored()).toEqual([9.5, 6.1, 6.4, 6.8]);
});
