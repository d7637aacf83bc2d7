import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const admin = makeUser({ role: 'admin', displayName: 'Demo Instructor' });
const member = makeUser({ role: 'member', displayName: 'Club Member One' });

describe('People (admin)', () => {
  it('when an admin adds someone without a password, then the invitation link is shown to copy', async () => {
    const guest = makeUser({
      displayName: 'Evening Guest',
      email: 'guest@example.test',
      invitePending: true,
    });
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: admin } },
      'GET /api/users': { body: page([admin, member]) },
      'POST /api/users': { status: 201, body: { user: guest, inviteUrl: '/invite/abc123' } },
    });
    const user = userEvent.setup();
    renderApp('/admin/users');

    await user.click(
      await screen.findByRole('button', { name: 'Add a person' }, { timeout: 5000 }),
    );
    const dialog = screen.getByRole('dialog', { name: 'Add a person' });
    await user.type(within(dialog).getByRole('textbox', { name: 'Name' }), 'Evening Guest');
    await user.type(within(dialog).getByRole('textbox', { name: 'E-mail' }), 'guest@example.test');
    await user.click(screen.getByRole('button', { name: 'Add and make link' }));

    const link = await screen.findByRole('textbox', { name: /Send this link to Evening Guest/ });
    expect(link).toHaveValue(`${window.location.origin}/invite/abc123`);
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      email: 'guest@example.test',
      displayName: 'Evening Guest',
      role: 'member',
    });
  });

  it('when the last admin would lose the role (409), then the server’s reason is shown', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: admin } },
      'GET /api/users': { body: page([admin, member]) },
      [`PATCH /api/users/${admin.id}`]: {
        status: 409,
        body: { error: { code: 'conflict', message: 'Lotwise needs at least one active admin.' } },
      },
    });
    const user = userEvent.setup();
    renderApp('/admin/users');

    await user.selectOptions(
      await screen.findByRole('combobox', { name: 'Role of Demo Instructor' }, { timeout: 5000 }),
      'viewer',
    );

    const confirm = screen.getByRole('dialog', { name: 'Change the role of Demo Instructor?' });
    await user.click(within(confirm).getByRole('button', { name: 'Make them a viewer' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Nothing changed for Demo Instructor');
    expect(alert).toHaveTextContent('Lotwise needs at least one active admin.');
  });

  it('when a role is chosen, then nothing changes until the change is confirmed in words', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: admin } },
      'GET /api/users': { body: page([admin, member]) },
      [`PATCH /api/users/${member.id}`]: { body: { user: { ...member, role: 'admin' } } },
    });
    const user = userEvent.setup();
    renderApp('/admin/users');

    const role = await screen.findByRole(
      'combobox',
      { name: 'Role of Club Member One' },
      { timeout: 5000 },
    );
    await user.selectOptions(role, 'admin');
    const confirm = screen.getByRole('dialog', { name: 'Change the role of Club Member One?' });
    expect(confirm).toHaveTextContent('Club Member One is a member and becomes an admin.');
    expect(confirm).toHaveTextContent('Everything, including users, roles, settings and backups');
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);

    await user.click(within(confirm).getByRole('button', { name: 'Cancel' }));
    expect(requests.some((r) => r.method === 'PATCH')).toBe(false);
    expect(role).toHaveValue('member');

    await user.selectOptions(role, 'admin');
    await user.click(screen.getByRole('button', { name: 'Make them an admin' }));
    expect(await screen.findByText('Club Member One is now an admin.')).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ role: 'admin' });
  });

  it('when a member opens the page, then it is not available to their role', async () => {
    const { requests } = mockFetch({ 'GET /api/auth/me': { body: { user: member } } });
    renderApp('/admin/users');

    expect(
      await screen.findByText('Not available with your role', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
    await waitFor(() => expect(requests.some((r) => r.url.pathname === '/api/users')).toBe(false));
  });
});
