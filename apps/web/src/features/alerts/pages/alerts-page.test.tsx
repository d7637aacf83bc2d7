import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Alert } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const lowStock: Alert = {
  key: 'low-stock:chemical:7',
  kind: 'low-stock',
  severity: 'warning',
  title: 'Low stock: Acetone',
  message: '277 mL usable in 1 container; reorder point 1 L.',
  chemical: { id: 7, name: 'Acetone' },
  container: null,
  dueOn: null,
  link: '/stock/chemicals/7',
};
const empty: Alert = {
  ...lowStock,
  key: 'low-stock:chemical:8',
  severity: 'critical',
  title: 'Out of stock: Zinc powder, stabilised',
  message: 'Nothing usable left; reorder point 100.0 g.',
  chemical: { id: 8, name: 'Zinc powder, stabilised' },
  link: '/stock/chemicals/8',
};

describe('Alerts page', () => {
  it('when conditions stand, then each shows its severity in words and links to its stock page', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/alerts': {
        body: {
          items: [empty, lowStock],
          evaluatedAt: '2026-12-01T08:00:00.000Z',
          expiryWindowDays: 30,
        },
      },
    });
    renderApp('/alerts');
    await screen.findByRole('link', { name: 'Low stock: Acetone' });
    const items = screen.getAllByRole('listitem');
    const acetone = items.find((item) => item.textContent?.includes('Low stock: Acetone'))!;
    expect(within(acetone).getByText('Needs attention')).toBeInTheDocument();
    expect(within(acetone).getByRole('link', { name: 'Low stock: Acetone' })).toHaveAttribute(
      'href',
      '/stock/chemicals/7',
    );
    const zinc = items.find((item) => item.textContent?.includes('Out of stock: Zinc'))!;
    expect(within(zinc).getByText('Act now')).toBeInTheDocument();
  });

  it('when nothing needs attention, then the page says so with the window it looked at', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/alerts': {
        body: { items: [], evaluatedAt: '2026-12-01T08:00:00.000Z', expiryWindowDays: 30 },
      },
    });
    renderApp('/alerts');
    expect(await screen.findByText('Nothing needs attention')).toBeInTheDocument();
    expect(screen.getByText(/next 30 days/)).toBeInTheDocument();
  });
});
