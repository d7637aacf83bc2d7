import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeContainer, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { daysLeftInMonth } from '../../../lib/dates';

const cabinet = {
  id: 7,
  name: 'Flammables cabinet',
  kind: 'cabinet' as const,
  parentId: 1,
  path: 'Room 101 › Flammables cabinet',
  depth: 1,
  storageGroups: ['flammable' as const],
  notes: '',
  flammableStorage: null,
  containerCount: 3,
  childCount: 0,
  createdAt: '2026-08-01T08:00:00.000Z',
  updatedAt: '2026-08-01T08:00:00.000Z',
};

describe('Containers list', () => {
  it('when filters are chosen, then they are written to the URL and sent to the server', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/containers': { body: page([makeContainer({ labelCode: 'LW-00007' })]) },
      'GET /api/locations': { body: page([cabinet]) },
      'GET /api/segregation/conflicts': { body: { items: [], total: 0, notice: '' } },
    });
    const user = userEvent.setup();
    const { router } = renderApp('/stock/containers');
    await screen.findByRole('link', { name: 'LW-00007' }, { timeout: 5000 });

    await user.click(screen.getByRole('button', { name: 'Expiring this month' }));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Status' }), 'open');
    await user.selectOptions(
      await screen.findByRole('combobox', { name: 'Location (and inside it)' }),
      '7',
    );
    await user.click(screen.getByRole('button', { name: 'Peroxide test due' }));

    const search = new URLSearchParams(router.state.location.search);
    expect(search.get('expiringWithinDays')).toBe(String(daysLeftInMonth()));
    expect(search.get('sort')).toBe('expiresOn.asc');
    expect(search.get('status')).toBe('open');
    expect(search.get('locationId')).toBe('7');
    expect(search.get('peroxideDue')).toBe('true');
    expect(screen.getByRole('button', { name: 'Expiring this month' })).toHaveAttribute(
      'aria-pressed',
      'true',
    );

    await waitFor(() => {
      const last = requests.filter((r) => r.url.pathname === '/api/containers').at(-1)!;
      expect(Object.fromEntries(last.url.searchParams)).toMatchObject({
        expiringWithinDays: String(daysLeftInMonth()),
        status: 'open',
        locationId: '7',
        peroxideDue: 'true',
        sort: 'expiresOn.asc',
      });
    });
  });

  it('when the URL carries filters, then the controls show them', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/containers': { body: page([]) },
      'GET /api/locations': { body: page([cabinet]) },
    });
    renderApp('/stock/containers?expired=true&storageGroup=flammable');

    expect(
      await screen.findByRole('button', { name: 'Expired' }, { timeout: 5000 }),
    ).toHaveAttribute('aria-pressed', 'true');
    expect(screen.getByRole('combobox', { name: 'Storage group' })).toHaveValue('flammable');
    expect(await screen.findByText('No containers match these filters')).toBeInTheDocument();
  });
});
