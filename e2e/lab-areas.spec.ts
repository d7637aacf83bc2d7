import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

/**
 * A room marked as a lab area through its page, its totals with the rule set's citation, and a
 * move that takes it over a flammable-liquid limit: warned before saving, saved on confirming.
 * The spec makes its own room, shelf and container, so other specs' data is left alone.
 */
test('a lab area counts its flammable liquids and warns before a move crosses a limit', async ({
  page,
}) => {
  test.setTimeout(90_000);
  await signIn(page, demo.manager);
  const stamp = Date.now();
  const api = page.request;

  const room = await api.post('/api/locations', {
    data: { name: `Solvent room ${stamp}`, kind: 'room' },
  });
  expect(room.status()).toBe(201);
  const roomId = ((await room.json()) as { id: number }).id;
  const shelf = await api.post('/api/locations', {
    data: { name: `Staging shelf ${stamp}`, kind: 'shelf' },
  });
  expect(shelf.status()).toBe(201);
  const shelfId = ((await shelf.json()) as { id: number }).id;

  const chemicals = (await (await api.get('/api/chemicals?q=ethanol')).json()) as {
    items: { id: number; name: string }[];
  };
  const ethanol = chemicals.items.find((c) => c.name === 'Ethanol')!;
  const lot = await api.post('/api/lots', {
    data: {
      chemicalId: ethanol.id,
      source: 'purchased',
      receivedOn: new Date().toISOString().slice(0, 10),
    },
  });
  expect(lot.status()).toBe(201);
  const lotId = ((await lot.json()) as { id: number }).id;
  // 5 L of ethanol (Class IB): more than a small Class D room may hold outside a cabinet.
  const received = await api.post('/api/containers', {
    data: { lotId, locationId: shelfId, quantity: 5000, unit: 'mL' },
  });
  expect(received.status()).toBe(201);
  const container = ((await received.json()) as { container: { id: number; labelCode: string } })
    .container;

  await page.goto(`/stock/locations/${roomId}`);
  const panel = page.getByRole('region', { name: 'Room rules' });
  await panel.getByRole('button', { name: 'Mark as a lab area' }).click();
  const form = page.getByRole('dialog', { name: `Mark Solvent room ${stamp} as a lab area` });
  await expect(form).toContainText('Figures from NFPA 45 (2024), Table 9.1.1.');
  await form.getByRole('radio', { name: /Class D/ }).check();
  await form.getByRole('textbox', { name: 'Floor area' }).fill('9.3');
  await form.getByRole('button', { name: 'Mark as a lab area' }).click();
  await expect(form).toBeHidden();
  await expect(panel).toContainText('Lab unit, Class D, 9.3 m², storey 1');

  await panel.getByRole('link', { name: 'Litres held against each limit' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText(`Solvent room ${stamp}`);
  await expect(page.getByText('Class I liquids outside cabinets and safety cans')).toBeVisible();
  await expect(page.getByText('NFPA 45 (2024), Table 9.1.1').first()).toBeVisible();
  await expect(page.getByText(/not an approval/).first()).toBeVisible();

  await page.goto(`/stock/containers/${container.id}`);
  await page.getByRole('button', { name: 'Move' }).click();
  const move = page.getByRole('dialog', { name: `Move ${container.labelCode}` });
  await move.getByRole('combobox', { name: 'Move to' }).selectOption(String(roomId));
  await move.getByRole('button', { name: 'Move container' }).click();
  const warning = page.getByRole('dialog', { name: /flammable-liquid limit|room rules/ });
  await expect(warning).toContainText(`Solvent room ${stamp}`);
  await expect(warning).toContainText(/against a limit of [\d.]+ L/);
  await expect(warning).toContainText('NFPA 45 (2024), Table 9.1.1');
  await warning.getByRole('button', { name: 'Save anyway' }).click();
  await expect(move.getByText(/is now at/)).toBeVisible();

  await page.goto('/stock/lab-areas');
  const row = page.getByRole('row', { name: new RegExp(`Solvent room ${stamp}`) });
  await expect(row).toContainText('Over a limit');
});
