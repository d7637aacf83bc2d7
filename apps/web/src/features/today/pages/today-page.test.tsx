import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { roomRulesReminder, safetyDeferral, type Today, type TodayItem } from '@lotwise/shared';
import { formatDate } from '../../../lib/format';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const expired: TodayItem = {
  key: 'expired:container:7',
  severity: 'warning',
  status: 'Expired',
  title: 'Copper(II) sulfate pentahydrate',
  detail: 'LW-00007 (20.00 g, Main lab / Cabinet A / Shelf 1) expired on 1 Jan 2021.',
  notes: [],
  link: '/stock/containers/7',
  chemicals: [
    { id: 3, name: 'Copper(II) sulfate pentahydrate', ghsPictograms: ['GHS07', 'GHS09'] },
  ],
  dueOn: '2021-01-01',
};

const plan: TodayItem = {
  key: 'plan:4',
  severity: 'critical',
  status: 'Short of 1 reagent',
  title: 'Aspirin from salicylic acid',
  detail: 'Today · 4 benches at ×0.5 · planned by Lab Technician',
  notes: ['Salicylic acid: short by 1.20 g', 'Reserved: 2 containers until 3 Dec 2026.'],
  link: '/preparations/plans/4',
  chemicals: [{ id: 1, name: 'Salicylic acid', ghsPictograms: ['GHS05', 'GHS07'] }],
  dueOn: '2026-12-03',
};

const none = (moreLink: string) => ({ total: 0, items: [], moreLink });

function startPage(sections: Today['sections']): Today {
  return {
    date: '2026-12-03',
    weekEnd: '2026-12-09',
    expiryWindowDays: 30,
    sections,
    safetyDeferral,
  };
}

describe('Start page', () => {
  it('when a manager opens Lotwise, then each section is a card of links to act on, with hazards and the count of the rest', async () => {
    mockFetch({
      'GET /api/auth/me': {
        body: { user: makeUser({ role: 'manager', displayName: 'Lab Technician' }) },
      },
      'GET /api/today': {
        body: startPage({
          belowReorderPoint: none('/alerts'),
          expiry: { total: 15, items: [expired], moreLink: '/alerts' },
          peroxideDue: none('/alerts'),
          plans: { total: 1, items: [plan], moreLink: '/preparations/plans' },
          myOpenRuns: none('/preparations/runs'),
          storageConflicts: none('/stock/segregation'),
          ordersWaiting: none('/purchases'),
        }),
      },
    });
    renderApp('/');
    expect(await screen.findByRole('heading', { name: 'Today', level: 1 })).toBeInTheDocument();
    expect(await screen.findByText(/What needs doing, as it stands right now/)).toBeInTheDocument();

    const expiry = await screen.findByRole('region', { name: 'Expired and expiring' });
    expect(within(expiry).getByRole('link', { name: expired.title })).toHaveAttribute(
      'href',
      '/stock/containers/7',
    );
    expect(within(expiry).getByText('Expired')).toBeInTheDocument();
    expect(within(expiry).getByText('GHS09')).toBeInTheDocument();
    expect(within(expiry).getByRole('link', { name: /and 14 more/ })).toHaveAttribute(
      'href',
      '/alerts',
    );

    const plans = screen.getByRole('region', { name: 'Sessions today and this week' });
    expect(within(plans).getByRole('link', { name: plan.title })).toHaveAttribute(
      'href',
      '/preparations/plans/4',
    );
    expect(within(plans).getByText('Salicylic acid: short by 1.20 g')).toBeInTheDocument();
    expect(within(plans).getByText('Short of 1 reagent')).toBeInTheDocument();
    expect(within(plans).getByRole('link', { name: /All plans/ })).toBeInTheDocument();

    // Empty sections say all is well.
    expect(screen.getByText('Nothing below its reorder point.')).toBeInTheDocument();
    expect(screen.getByText('No peroxide test is due in the next 30 days.')).toBeInTheDocument();
    expect(screen.getByText('None of your runs is waiting to be recorded.')).toBeInTheDocument();
    expect(screen.getByText('No shared order needs anything from you.')).toBeInTheDocument();
    // A section the answer leaves out is not shown at all.
    expect(screen.queryByRole('region', { name: 'E-mails not sent' })).not.toBeInTheDocument();
    expect(screen.getByText(safetyDeferral)).toBeInTheDocument();
  });

  it('when a viewer opens Lotwise, then only the sections a viewer may see are there', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/today': {
        body: startPage({
          plans: none('/preparations/plans'),
          storageConflicts: none('/stock/segregation'),
        }),
      },
    });
    renderApp('/');
    expect(
      await screen.findByRole('region', { name: 'Sessions today and this week' }),
    ).toBeInTheDocument();
    expect(
      screen.getAllByRole('region').map((region) => region.getAttribute('aria-labelledby')),
    ).toEqual(['today-plans', 'today-storageConflicts']);
    expect(
      screen.getByText(`No session is planned from today to ${formatDate('2026-12-09')}.`),
    ).toBeInTheDocument();
    expect(
      screen.getByText('Every place holds only what may be stored together.'),
    ).toBeInTheDocument();
  });

  it('when the start page cannot be loaded, then it says so and offers to try again', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/today': {
        status: 500,
        body: { error: { code: 'internal', message: 'Something went wrong on the server.' } },
      },
    });
    renderApp('/');
    expect(await screen.findByText('The start page could not be loaded')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeInTheDocument();
  });

  it('when signed in, then "Today" leads the navigation and the home link opens the start page', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
      'GET /api/today': { body: startPage({}) },
    });
    renderApp('/');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    const first = within(nav).getAllByRole('link')[0]!;
    expect(first).toHaveTextContent('Today');
    expect(first).toHaveAttribute('href', '/');
    expect(first).toHaveAttribute('aria-current', 'page');
    expect(screen.getByRole('link', { name: 'Lotwise, home' })).toHaveAttribute('href', '/');
  });

  it('when a lab area is near a flammable-liquid limit, then the start page names it with the limit, the rule set and the reminder, and links to its page', async () => {
    const area: TodayItem = {
      key: 'lab-area:1',
      severity: 'warning',
      status: 'Near a limit',
      title: 'Room 101 Teaching lab',
      detail: 'One flammable-liquid limit at 90 % or more (NFPA 45 (2024), Table 9.1.1).',
      notes: [
        'Class I liquids, cabinets and safety cans included: 30.7 L of 32.6 L (94 %).',
        roomRulesReminder,
      ],
      link: '/stock/lab-areas/1',
      chemicals: [],
      dueOn: null,
    };
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'manager' }) } },
      'GET /api/today': {
        body: startPage({
          labAreaLimits: { total: 1, items: [area], moreLink: '/stock/lab-areas' },
        }),
      },
    });
    renderApp('/');

    const section = await screen.findByRole(
      'region',
      { name: 'Lab areas near a flammable-liquid limit' },
      { timeout: 5000 },
    );
    expect(within(section).getByRole('link', { name: /Room 101 Teaching lab/ })).toHaveAttribute(
      'href',
      '/stock/lab-areas/1',
    );
    expect(section).toHaveTextContent('Near a limit');
    expect(section).toHaveTextContent('NFPA 45 (2024), Table 9.1.1');
    expect(section).toHaveTextContent('30.7 L of 32.6 L (94 %)');
    expect(section).toHaveTextContent(/not an approval/);
  });
});
