import AxeBuilder from '@axe-core/playwright';
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { demo, signIn } from './support';

/**
 * The run record: a procedure with steps and a run of it made here through the API (the demo
 * runs are left alone), a timeline posted with one reading outside its step's window, then the
 * run page and its printable notebook page read as a person would.
 */

async function chemicalId(api: APIRequestContext, name: string): Promise<number> {
  const answer = await api.get(`/api/chemicals?q=${encodeURIComponent(name)}&pageSize=10`);
  expect(answer.ok()).toBe(true);
  const { items } = (await answer.json()) as { items: { id: number; name: string }[] };
  const found = items.find((item) => item.name === name);
  expect(found, `demo chemical ${name}`).toBeTruthy();
  return found!.id;
}

/** Serious and critical axe findings (WCAG 2.0/2.1 A and AA), as the page scan judges them. */
async function seriousFindings(page: Page) {
  const results = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'])
    .analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

async function runWithTimeline(api: APIRequestContext) {
  const [benzaldehyde, acetone, product] = await Promise.all([
    chemicalId(api, 'Benzaldehyde'),
    chemicalId(api, 'Acetone'),
    chemicalId(api, 'Dibenzalacetone'),
  ]);
  const title = `Notebook aldol ${Date.now().toString(36)}`;
  const created = await api.post('/api/procedures', {
    data: {
      title,
      reference: 'Invented for the notebook walkthrough',
      baseScale: 'one bench: 1.0 mL benzaldehyde',
      cautions: 'Sodium hydroxide solution is corrosive.',
      cautionFlags: { exothermicAddition: true, keepBelowC: 30 },
      lines: [
        {
          chemicalId: benzaldehyde,
          role: 'limiting-reagent',
          quantity: 1,
          unit: 'mL',
          coefficient: 2,
        },
        { chemicalId: acetone, role: 'reagent', quantity: 0.4, unit: 'mL', coefficient: 1 },
        { chemicalId: product, role: 'product', coefficient: 1 },
      ],
      steps: [
        { text: 'Mix the benzaldehyde and the acetone in ethanol', durationMinutes: 5 },
        {
          text: 'Add the base dropwise, keeping the mixture between 20 and 30 °C',
          durationMinutes: 15,
          temperatureLowC: 20,
          temperatureHighC: 30,
          outsideWindow: 'Slow the addition and cool in a water bath',
          caution: 'exothermicAddition',
        },
        { text: 'Stir at room temperature', durationMinutes: 30 },
      ],
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  const procedure = (await created.json()) as { id: number };
  const opened = await api.post('/api/runs', { data: { procedureId: procedure.id } });
  expect(opened.status()).toBe(201);
  const run = (await opened.json()) as { id: number };

  const start = Date.now() - 60 * 60_000;
  const at = (minutes: number) => new Date(start + minutes * 60_000).toISOString();
  const entries = [
    { kind: 'step-start', at: at(0), stepIndex: 0 },
    { kind: 'step-end', at: at(5), stepIndex: 0 },
    { kind: 'step-start', at: at(5), stepIndex: 1 },
    { kind: 'reading', at: at(8), stepIndex: 1, temperatureC: 24 },
    { kind: 'reading', at: at(12), stepIndex: 1, temperatureC: 33.5 },
    { kind: 'note', at: at(13), stepIndex: 1, text: 'Addition slowed, water bath added' },
    { kind: 'reading', at: at(17), stepIndex: 1, temperatureC: 27 },
    { kind: 'step-end', at: at(20), stepIndex: 1 },
    { kind: 'step-start', at: at(20), stepIndex: 2 },
  ];
  for (const [index, entry] of entries.entries()) {
    const answer = await api.post(`/api/runs/${run.id}/timeline`, {
      data: { clientId: `notebook-${run.id}-${index}`, ...entry },
    });
    expect(answer.status(), await answer.text()).toBe(201);
  }
  return { runId: run.id, title };
}

test('a run’s timeline, temperature chart and deviation on its page and its printable notebook page', async ({
  page,
}, testInfo) => {
  // a dozen API calls, an axe scan and a PDF: more than the default on a busy machine
  test.setTimeout(120_000);
  await signIn(page, demo.manager);
  const { runId, title } = await runWithTimeline(page.request);

  await page.goto(`/preparations/runs/${runId}`);
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
  const timeline = page.getByRole('region', { name: 'Timeline' });
  await expect(timeline.getByTestId('timeline-entry')).toHaveCount(9);
  await expect(timeline.getByText('Deviation: Reading outside the window')).toBeVisible();
  const chart = page.getByRole('region', { name: 'Temperature during the run' });
  await expect(chart.getByTestId('window-band')).toHaveCount(1);
  await expect(chart.getByTestId('reading-outside')).toHaveCount(1);
  await expect(chart.getByText('33.5 °C outside')).toBeVisible();
  const deviations = page.getByRole('region', { name: 'Deviations' });
  await expect(deviations.getByTestId('deviation-count')).toHaveText('1 deviation');
  await expect(deviations).toContainText('Window: 20–30 °C');
  await expect(deviations).toContainText('What to do: Slow the addition and cool in a water bath');

  // the filled timeline, chart and deviations (the page scan sees a demo run's)
  expect(await seriousFindings(page)).toEqual([]);

  await page.getByRole('link', { name: 'Notebook page' }).click();
  await expect(page).toHaveURL(new RegExp(`/preparations/runs/${runId}/notebook$`));
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
  await expect(page.getByTestId('temperature-chart')).toBeVisible();
  await expect(page.getByTestId('reading-outside')).toHaveCount(1);
  await expect(page.getByTestId('deviation-count')).toHaveText('1 deviation');
  const safety = page.getByRole('region', { name: /Hazards of every chemical drawn or made/ });
  await expect(safety).toContainText('Benzaldehyde');
  await expect(safety).toContainText(/H\d{3}/);
  await expect(safety).toContainText(
    'SDS, local regulations and licensed practice take precedence',
  );
  await expect(safety).toContainText('not a safety approval');
  await expect(page.getByRole('region', { name: 'Signatures' })).toBeVisible();
  const pdf = await page.pdf({ format: 'A4', printBackground: true });
  await testInfo.attach('notebook.pdf', { body: pdf, contentType: 'application/pdf' });
  expect(pdf.byteLength).toBeGreaterThan(10_000);
});
