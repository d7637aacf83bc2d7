import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

describe('Your password', () => {
  it('when the current password is right, then the new one is sent and the page says other sessions ended', async () => {
    const member = makeUser({ role: 'member' });
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'POST /api/auth/password': { body: { user: member } },
    });
    const user = userEvent.setup();
    renderApp('/account');

    await screen.findByRole('heading', { name: 'Your password' });
    await user.type(screen.getByLabelText('Current password'), 'the-old-password');
    await user.type(screen.getByLabelText('New password'), 'a-new-long-password');
    await user.type(screen.getByLabelText('New password again'), 'a-new-long-password');
    await user.click(screen.getByRole('button', { name: 'Save new password' }));

    expect(await screen.findByText('Your new password is saved')).toBeInTheDocument();
    expect(screen.getByText(/other place you were signed in has been signed out/)).toBeVisible();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      currentPassword: 'the-old-password',
      newPassword: 'a-new-long-password',
    });
  });

  it('when the server says the current password is wrong, then that field shows it', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'POST /api/auth/password': {
        status: 400,
        body: {
          error: {
            code: 'validation_failed',
            message: 'The current password is not right.',
            fields: { currentPassword: 'is not right' },
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/account');

    await user.type(await screen.findByLabelText('Current password'), 'a-wrong-guess');
    await user.type(screen.getByLabelText('New password'), 'a-new-long-password');
    await user.type(screen.getByLabelText('New password again'), 'a-new-long-password');
    await user.click(screen.getByRole('button', { name: 'Save new password' }));

    expect(await screen.findByText('The current password is not right')).toBeInTheDocument();
  });

  it('when the two new passwords differ, then nothing is sent', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'member' }) } },
    });
    const user = userEvent.setup();
    renderApp('/account');

    await user.type(await screen.findByLabelText('Current password'), 'the-old-password');
    await user.type(screen.getByLabelText('New password'), 'a-new-long-password');
    await user.type(screen.getByLabelText('New password again'), 'another-long-password');
    await user.click(screen.getByRole('button', { name: 'Save new password' }));

    expect(await screen.findByText(/does not match the new password/i)).toBeInTheDocument();
    expect(requests.filter((r) => r.method === 'POST')).toEqual([]);
  });
});
