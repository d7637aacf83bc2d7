import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const admin = makeUser({ role: 'admin', displayName: 'Demo Instructor' });
const schedule = { intervalHours: 24, keep: 14, folder: '/srv/lotwise/backups' };

describe('Backups (admin)', () => {
  it('when backups exist, then each shows its time, kind in words, size and a download link', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: admin } },
      'GET /api/backups': {
        body: {
          items: [
            {
              name: 'lotwise-20261202T030000Z-scheduled.sqlite',
              kind: 'scheduled',
              takenAt: '2026-12-02T03:00:00.000Z',
              bytes: 5347738,
            },
            {
              name: 'lotwise-20261201T160512Z-manual.sqlite',
              kind: 'manual',
              takenAt: '2026-12-01T16:05:12.000Z',
              bytes: 520192,
            },
          ],
          schedule,
          running: false,
        },
      },
    });
    renderApp('/admin/backups');

    const table = await screen.findByRole(
      'table',
      { name: 'Backups, newest first' },
      { timeout: 5000 },
    );
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(2);
    expect(within(rows[0]!).getByText('scheduled')).toBeInTheDocument();
    expect(within(rows[0]!).getByText('5.1 MiB')).toBeInTheDocument();
    expect(within(rows[1]!).getByText('by hand')).toBeInTheDocument();
    expect(within(rows[1]!).getByText('508.0 KiB')).toBeInTheDocument();
    expect(
      screen.getByRole('link', { name: 'Download lotwise-20261201T160512Z-manual.sqlite' }),
    ).toHaveAttribute('href', '/api/backups/lotwise-20261201T160512Z-manual.sqlite/download');
    expect(screen.getByText(/every 24 hours and keeps the latest 14/)).toBeInTheDocument();
  });

  it('when there is none yet and the admin backs up now, then the new backup is confirmed', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: admin } },
      'GET /api/backups': { body: { items: [], schedule, running: false } },
      'POST /api/backups': {
        status: 201,
        body: {
          name: 'lotwise-20261202T230000Z-manual.sqlite',
          kind: 'manual',
          takenAt: '2026-12-02T23:00:00.000Z',
          bytes: 520192,
          rowCounts: { users: 4, containers: 31, ledger_entries: 212 },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/admin/backups');

    expect(await screen.findByText('No backups yet', {}, { timeout: 5000 })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Back up now' }));

    const done = await screen.findByText('Backup taken');
    expect(done.closest('[role="status"]')).toHaveTextContent(
      'lotwise-20261202T230000Z-manual.sqlite, 508.0 KiB: the rows of all 3 tables',
    );
    expect(requests.filter((r) => r.method === 'POST')).toHaveLength(1);
  });

  it('when taking a backup is refused, then the server’s reason is shown', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: admin } },
      'GET /api/backups': { body: { items: [], schedule, running: false } },
      'POST /api/backups': {
        status: 409,
        body: {
          error: {
            code: 'conflict',
            message: 'A backup is being taken right now; it will be listed when done.',
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/admin/backups');
    await user.click(await screen.findByRole('button', { name: 'Back up now' }, { timeout: 5000 }));
    expect(await screen.findByRole('alert')).toHaveTextContent(/being taken right now/);
  });
});
