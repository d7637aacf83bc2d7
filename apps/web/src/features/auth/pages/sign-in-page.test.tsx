import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const unauthenticated = {
  status: 401,
  body: { error: { code: 'unauthenticated', message: 'Sign in first.' } },
};

describe('Sign-in', () => {
  it('when someone signed out opens a page, then after signing in they land where they were heading', async () => {
    const instructor = makeUser({ role: 'admin', email: 'instructor@example.test' });
    let signedIn = false;
    const { requests } = mockFetch({
      'GET /api/auth/me': () => (signedIn ? { body: { user: instructor } } : unauthenticated),
      'POST /api/auth/login': () => {
        signedIn = true;
        return { body: { user: instructor } };
      },
      'GET /api/users': { body: page([instructor]) },
    });
    const user = userEvent.setup();
    const { router } = renderApp('/admin/users?q=tess');

    await screen.findByRole('heading', { name: 'Sign in to Lotwise' });
    expect(router.state.location.pathname).toBe('/sign-in');

    await user.type(screen.getByRole('textbox', { name: 'E-mail' }), 'Instructor@example.test');
    await user.type(screen.getByLabelText('Password'), 'correct horse battery');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await screen.findByRole('heading', { name: 'People' });
    expect(`${router.state.location.pathname}${router.state.location.search}`).toBe(
      '/admin/users?q=tess',
    );
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      email: 'instructor@example.test',
      password: 'correct horse battery',
    });
  });

  it('when too many attempts were made, then the rate-limit message shows', async () => {
    mockFetch({
      'GET /api/auth/me': unauthenticated,
      'POST /api/auth/login': {
        status: 429,
        body: { error: { code: 'rate_limited', message: 'Too many attempts from this address.' } },
      },
    });
    const user = userEvent.setup();
    renderApp('/sign-in');

    await user.type(await screen.findByRole('textbox', { name: 'E-mail' }), 'member@example.test');
    await user.type(screen.getByLabelText('Password'), 'whatever-it-is');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Too many sign-in attempts');
    expect(alert).toHaveTextContent('Too many attempts from this address.');
  });

  it('when the e-mail is not an address, then the field says so before anything is sent', async () => {
    const { requests } = mockFetch({ 'GET /api/auth/me': unauthenticated });
    const user = userEvent.setup();
    renderApp('/sign-in');

    await user.type(await screen.findByRole('textbox', { name: 'E-mail' }), 'not-an-address');
    await user.type(screen.getByLabelText('Password'), 'x');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() =>
      expect(screen.getByRole('textbox', { name: 'E-mail' })).toHaveAccessibleDescription(
        /must be an e-mail address/,
      ),
    );
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });
});
