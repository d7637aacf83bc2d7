import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../test/fetch-mock';
import { makeUser } from '../../test/factories';
import { renderApp } from '../../test/render-app';

async function openAccountPage() {
  mockFetch({ 'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } } });
  const view = renderApp('/account');
  await screen.findByRole('heading', { name: 'Your password' });
  return view;
}

function menuPanel(): HTMLElement {
  const button = screen.getByRole('button', { name: 'Menu' });
  const panel = document.getElementById(button.getAttribute('aria-controls') ?? '');
  if (!panel) throw new Error('The menu button controls no element');
  return panel;
}

describe('The menu button (phone)', () => {
  it('when tapped, then the menu opens with focus on its first entry, and tapping again closes it', async () => {
    await openAccountPage();
    const user = userEvent.setup();
    const button = screen.getByRole('button', { name: 'Menu' });
    expect(button).toHaveAttribute('aria-expanded', 'false');
    expect(menuPanel()).toHaveAttribute('data-open', 'false');

    await user.click(button);

    expect(button).toHaveAttribute('aria-expanded', 'true');
    expect(menuPanel()).toHaveAttribute('data-open', 'true');
    expect(within(menuPanel()).getByRole('link', { name: 'Today' })).toHaveFocus();

    await user.click(button);
    expect(button).toHaveAttribute('aria-expanded', 'false');
    expect(button).toHaveFocus();
  });

  it('when Escape is pressed inside the open menu, then it closes and focus returns to the button', async () => {
    await openAccountPage();
    const user = userEvent.setup();
    const button = screen.getByRole('button', { name: 'Menu' });
    await user.click(button);
    await user.tab();
    expect(menuPanel()).toContainElement(document.activeElement as HTMLElement);

    await user.keyboard('{Escape}');

    expect(button).toHaveAttribute('aria-expanded', 'false');
    expect(menuPanel()).toHaveAttribute('data-open', 'false');
    expect(button).toHaveFocus();
  });

  it('when an entry is followed, then the menu closes on the new page and that entry is current', async () => {
    const { router } = await openAccountPage();
    const user = userEvent.setup();
    const button = screen.getByRole('button', { name: 'Menu' });
    await user.click(button);

    await user.click(within(menuPanel()).getByRole('link', { name: 'Runs' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/preparations/runs'));
    const nav = screen.getByRole('navigation', { name: 'Main' });
    await waitFor(() =>
      expect(within(nav).getByRole('link', { name: 'Runs' })).toHaveAttribute(
        'aria-current',
        'page',
      ),
    );
    expect(button).toHaveAttribute('aria-expanded', 'false');
    expect(within(nav).getByRole('link', { name: 'Preparations' })).not.toHaveAttribute(
      'aria-current',
    );
  });

  it('when the menu is open, then who is signed in and the way to sign out are inside it', async () => {
    await openAccountPage();
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Menu' }));
    const panel = menuPanel();
    expect(within(panel).getByText('Viewer')).toBeInTheDocument();
    expect(within(panel).getByRole('button', { name: 'Sign out' })).toBeInTheDocument();
  });
});
