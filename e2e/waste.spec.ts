import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

test.setTimeout(90_000);

test('when a run sends its filtrate to a waste container, then the waste page shows it and a pickup closes the container', async ({
  page,
}) => {
  await signIn(page, demo.manager);
  const api = page.request;
  // A waste container of this spec's own, in the demo's waste station.
  const areas = (await (await api.get('/api/waste-areas')).json()) as { locationId: number }[];
  const title = `Ester filtrates ${Date.now()}`;
  const created = await api.post('/api/waste-containers', {
    data: {
      title,
      locationId: areas[0]!.locationId,
      capacity: 5,
      capacityUnit: 'L',
      characteristics: ['ignitable'],
    },
  });
  expect(created.status()).toBe(201);
  const bin = (await created.json()) as { id: number; labelCode: string };

  // A run of the aspirin prep: the form offers the waste container for its filtrate.
  const procedures = (await (await api.get('/api/procedures')).json()) as {
    items: { id: number; title: string }[];
  };
  const procedure = procedures.items.find((p) => /aspirin/i.test(p.title)) ?? procedures.items[0]!;
  const run = (await (
    await api.post('/api/runs', { data: { procedureId: procedure.id } })
  ).json()) as { id: number };
  await page.goto(`/preparations/runs/${run.id}/record`);
  const form = page.getByRole('form', { name: 'Record the run' });
  await expect(form).toBeVisible({ timeout: 20_000 });
  await form.getByLabel('Waste container').selectOption(String(bin.id));
  await expect(form.getByLabel('What goes in')).toHaveValue(
    `Filtrate and washings of run #${run.id}`,
  );

  // Recorded with its draws (the form's draws are walked by the preparations spec).
  const lines = (
    (await (await api.get(`/api/procedures/${procedure.id}`)).json()) as {
      lines: { role: string; optional?: boolean; chemical: { id: number }; unit?: string }[];
    }
  ).lines;
  const drawn = [];
  for (const [lineIndex, line] of lines.entries()) {
    if (line.role === 'product' || line.optional) continue;
    const bottles = (await (
      await api.get(`/api/containers?chemicalId=${line.chemical.id}&pageSize=50`)
    ).json()) as { items: { id: number; quantity: number; unit: string; status: string }[] };
    const bottle = bottles.items.find((c) => c.status !== 'disposed' && c.quantity > 0.5);
    if (!bottle) continue;
    drawn.push({
      lineIndex,
      draws: [{ containerId: bottle.id, amount: 0.5, unit: bottle.unit }],
    });
  }
  const recorded = await api.post(`/api/runs/${run.id}/record`, {
    data: {
      lines: drawn,
      waste: [
        {
          wasteContainerId: bin.id,
          description: `Filtrate of run #${run.id}`,
          quantity: 35,
          unit: 'mL',
          chemicalIds: lines.filter((l) => l.role !== 'product').map((l) => l.chemical.id),
        },
      ],
      confirm: true,
    },
  });
  expect(recorded.status(), await recorded.text()).toBe(200);
  await page.goto(`/stock/waste/${bin.id}`);
  await expect(page.getByText(`Filtrate of run #${run.id}`)).toBeVisible();
  await expect(page.getByRole('link', { name: `run #${run.id}` })).toBeVisible();

  // A manual addition, as a filtrate poured off at the bench.
  await expect(page.getByRole('heading', { level: 1 })).toContainText(bin.labelCode);
  const add = page.getByRole('form', { name: 'Add contents' });
  await add.getByLabel('What went in').fill(`Mother liquor of run #${run.id}`);
  await add.getByLabel('About how much').fill('120');
  await add.getByLabel('Unit').fill('mL');
  await add.getByRole('button', { name: `Add to ${bin.labelCode}` }).click();
  await expect(page.getByText(`Mother liquor of run #${run.id}`)).toBeVisible();
  await expect(page.getByText('Hazardous waste', { exact: true })).toBeVisible();

  // The waste page lists it; a pickup closes it.
  await page.goto('/stock/waste');
  await expect(page.getByRole('link', { name: bin.labelCode })).toBeVisible();
  const pickup = page.getByRole('form', { name: 'Record a pickup' });
  await pickup.getByRole('checkbox', { name: new RegExp(bin.labelCode) }).check();
  await pickup.getByLabel('Contractor').fill('Riverside Disposal Services (fictional)');
  await pickup.getByLabel('Manifest number').fill(`EX-E2E-${run.id}`);
  await pickup.getByRole('button', { name: 'Record the pickup' }).click();
  await expect(pickup.getByRole('status')).toContainText(bin.labelCode);
  await expect(
    page.getByRole('region', { name: 'Pickups' }).getByText(`EX-E2E-${run.id}`),
  ).toBeVisible();
  await page.screenshot({ path: 'e2e/.artifacts/waste-page.png', fullPage: true });
  await expect(page.getByRole('link', { name: bin.labelCode })).toHaveCount(0);
});
