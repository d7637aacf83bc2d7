import { render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { describe, expect, it } from 'vitest';
import type { Role } from '@lotwise/shared';
import { SideNav } from './side-nav';

function renderNav(role: Role, path = '/') {
  render(
    <MemoryRouter initialEntries={[path]}>
      <SideNav role={role} />
    </MemoryRouter>,
  );
}

function navLabels(role: Role): string[] {
  renderNav(role);
  const nav = screen.getByRole('navigation', { name: 'Main' });
  return within(nav)
    .getAllByRole('link')
    .map((link) => link.textContent?.replace('coming', '').trim() ?? '');
}

describe('SideNav', () => {
  it('when a viewer signs in, then the start page and only read-only places show, runs among them', () => {
    expect(navLabels('viewer')).toEqual([
      'Today',
      'Chemicals',
      'Stock',
      'Preparations',
      'Runs',
      'Help',
    ]);
  });

  it('when a member signs in, then runs, alerts and purchasing (orders, restock, suppliers, their purchases) show but not administration', () => {
    expect(navLabels('member')).toEqual([
      'Today',
      'Chemicals',
      'Stock',
      'Preparations',
      'Runs',
      'Alerts',
      'Orders',
      'Restock',
      'My purchases',
      'Suppliers',
      'Help',
    ]);
    expect(screen.getByText('Purchasing')).toBeInTheDocument();
  });

  it('when an admin signs in, then People, Outbox, the watch lists and Backups under Admin show too', () => {
    expect(navLabels('admin')).toEqual([
      'Today',
      'Chemicals',
      'Stock',
      'Preparations',
      'Runs',
      'Alerts',
      'Orders',
      'Restock',
      'My purchases',
      'Suppliers',
      'People',
      'Outbox',
      'Watched chemicals',
      'Watch lists',
      'Backups',
      'Help',
    ]);
    expect(screen.getByText('Admin')).toBeInTheDocument();
  });

  it('marks capabilities not built yet as coming', () => {
    render(
      <MemoryRouter>
        <SideNav role="manager" />
      </MemoryRouter>,
    );
    expect(screen.getByRole('link', { name: /Orders/ })).not.toHaveTextContent('coming');
    expect(screen.getByRole('link', { name: /Preparations/ })).not.toHaveTextContent('coming');
    expect(screen.getByRole('link', { name: /Stock/ })).not.toHaveTextContent('coming');
    expect(screen.getByRole('link', { name: /Chemicals/ })).not.toHaveTextContent('coming');
  });

  it.each([
    ['/preparations/runs', 'Runs'],
    ['/preparations/runs/7/record', 'Runs'],
    ['/preparations/plans/2', 'Preparations'],
    ['/orders/restock', 'Restock'],
    ['/orders/5', 'Orders'],
    ['/stock/containers/13', 'Stock'],
  ])('when the page is %s, then %s alone is the current entry', (path, label) => {
    renderNav('manager', path);
    const current = within(screen.getByRole('navigation', { name: 'Main' }))
      .getAllByRole('link')
      .filter((link) => link.getAttribute('aria-current') === 'page');
    expect(current.map((link) => link.textContent?.trim())).toEqual([label]);
  });
});
