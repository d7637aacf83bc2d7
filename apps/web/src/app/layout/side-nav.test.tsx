import { render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { describe, expect, it } from 'vitest';
import type { Role } from '@lotwise/shared';
import { SideNav } from './side-nav';

function navLabels(role: Role): string[] {
  render(
    <MemoryRouter>
      <SideNav role={role} />
    </MemoryRouter>,
  );
  const nav = screen.getByRole('navigation', { name: 'Main' });
  return within(nav)
    .getAllByRole('link')
    .map((link) => link.textContent?.replace('coming', '').trim() ?? '');
}

describe('SideNav', () => {
  it('when a viewer signs in, then the start page and only read-only places show', () => {
    expect(navLabels('viewer')).toEqual(['Today', 'Chemicals', 'Stock', 'Preparations', 'Help']);
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

  it('when an admin signs in, then People, Outbox and Backups under Admin show too', () => {
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
});
