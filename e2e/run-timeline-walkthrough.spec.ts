import { expect, test } from '@playwright/test';
import { demo, signIn } from './support';

interface RunListItem {
  id: number;
  deviationCount: number;
  procedure: { title: string };
}

test.describe("a recorded run's timeline", () => {
  // The run page loads its code, then the run and its timeline.
  test.describe.configure({ timeout: 90_000 });
  const opened = { timeout: 30_000 };

  test('when a member opens the demo run whose addition ran warm, then its timeline, temperature chart and deviation are shown', async ({
    page,
  }) => {
    await signIn(page, demo.member);
    const answer = await page.request.get('/api/runs?status=recorded&pageSize=50');
    expect(answer.ok()).toBe(true);
    const { items } = (await answer.json()) as { items: RunListItem[] };
    // The demo seed's dibenzalacetone run with one reading above "at most 30 °C".
    const run = items.find(
      (item) => item.procedure.title.startsWith('Dibenzalacetone') && item.deviationCount > 0,
    );
    expect(run, 'the demo run with a deviation').toBeDefined();

    // On a phone: the run's record is read at the bench as much as at a desk.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`/preparations/runs/${run!.id}`);

    const timeline = page.getByRole('region', { name: 'Timeline' });
    await expect(timeline).toBeVisible(opened);
    await expect(timeline.getByText(/31\.5\s*°C/).first()).toBeVisible();
    await expect(timeline.getByText(/ice put into the water bath/).first()).toBeVisible();

    const chart = page.getByRole('region', { name: 'Temperature during the run' });
    await expect(chart.getByRole('img').first()).toBeVisible();

    const deviations = page.getByRole('region', { name: 'Deviations' });
    await expect(deviations.getByRole('listitem')).toHaveCount(1);
    await expect(deviations).toContainText('31.5 °C');
    await expect(deviations).toContainText('Stop the addition');

    // Nothing runs off the side of a phone's screen.
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(390);
  });
});
