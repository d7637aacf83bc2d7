import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { paths } from '../../config/paths';
import { mockFetch } from '../../test/fetch-mock';
import { makeContainer, makeUser, page } from '../../test/factories';
import { renderApp } from '../../test/render-app';
import { drawSearchHint, runStartFor } from './keyboard-shortcuts';

const openApi = {
  openapi: '3.1.0',
  info: { title: 'Lotwise API', version: '0.1.0' },
  paths: {},
};

function setup(role: 'member' | 'viewer' = 'member') {
  return mockFetch({
    'GET /api/auth/me': { body: { user: makeUser({ role }) } },
    'GET /api/openapi.json': { body: openApi },
    'GET /api/containers/42': { body: makeContainer({ id: 42, labelCode: 'LW-00042' }) },
    'GET /api/containers/42/ledger': { body: page([]) },
    'GET /api/locations': { body: page([]) },
    'GET /api/chemicals': { body: page([]) },
  });
}

/** The shortcuts load just after the first page shows (a lazy part of the app shell). */
async function shortcutsListening() {
  await waitFor(() => expect(document.body.dataset.shortcuts).toBe('on'));
}

async function openHelp() {
  const view = renderApp(paths.help);
  await screen.findByRole('heading', { name: 'Help', level: 1 });
  await shortcutsListening();
  return view;
}

describe('keyboard shortcuts', () => {
  // Escape (the native dialog's cancel, which jsdom does not send) is driven in e2e/help-and-shortcuts.spec.ts.
  it('when ? is pressed, then the overlay lists the shortcuts, and closing it gives the focus back', async () => {
    setup();
    const user = userEvent.setup();
    await openHelp();
    const helpLink = screen.getByRole('link', { name: 'Help' });
    helpLink.focus();

    await user.keyboard('?');

    const dialog = await screen.findByRole('dialog', { name: 'Keyboard shortcuts' });
    for (const label of ['Search', 'Record a draw', 'Record a run', 'Go to stock']) {
      expect(within(dialog).getByText(label)).toBeInTheDocument();
    }
    await user.click(within(dialog).getByRole('button', { name: 'Close' }));
    await waitFor(() =>
      expect(screen.queryByRole('dialog', { name: 'Keyboard shortcuts' })).not.toBeInTheDocument(),
    );
    await waitFor(() => expect(helpLink).toHaveFocus());
  });

  it('when a viewer opens the overlay, then draws and runs are not offered', async () => {
    setup('viewer');
    const user = userEvent.setup();
    await openHelp();
    await user.keyboard('?');
    const dialog = await screen.findByRole('dialog', { name: 'Keyboard shortcuts' });
    expect(within(dialog).queryByText('Record a draw')).not.toBeInTheDocument();
    expect(within(dialog).getByText('Go to stock')).toBeInTheDocument();
  });

  it('when keys are typed into a field, then no shortcut fires', async () => {
    setup();
    const user = userEvent.setup();
    const { router } = await openHelp();
    await user.type(await screen.findByRole('searchbox', { name: 'Filter operations' }), '?gsr');
    expect(screen.queryByRole('dialog', { name: 'Keyboard shortcuts' })).not.toBeInTheDocument();
    expect(router.state.location.pathname).toBe(paths.help);
    expect(screen.getByRole('searchbox', { name: 'Filter operations' })).toHaveValue('?gsr');
  });

  it('when g then s is pressed, then the stock page opens; g then h opens the start page', async () => {
    setup();
    const user = userEvent.setup();
    const { router } = await openHelp();
    await user.keyboard('gs');
    await waitFor(() => expect(router.state.location.pathname).toBe(paths.stock), {
      timeout: 8000,
    });
    await router.navigate(paths.help);
    await user.keyboard('gh');
    await waitFor(() => expect(router.state.location.pathname).not.toBe(paths.help), {
      timeout: 8000,
    });
    // The start page (the address `/` may send a role on to its first page).
    expect([paths.home, paths.chemicals]).toContain(router.state.location.pathname);
  });

  it('when r is pressed, then the page that opens a run is shown', async () => {
    setup();
    const user = userEvent.setup();
    const { router } = await openHelp();
    await user.keyboard('r');
    await waitFor(() => expect(router.state.location.pathname).toBe(paths.runNew), {
      timeout: 8000,
    });
  });

  it('when / or d is pressed away from a container, then the search at the top takes the cursor (d with a hint)', async () => {
    setup();
    const user = userEvent.setup();
    await openHelp();
    const search = screen.getByRole('combobox', { name: 'Search chemicals and containers' });

    await user.keyboard('/');
    expect(search).toHaveFocus();
    expect(search).toHaveValue('');
    await user.click(screen.getByRole('heading', { name: 'Help', level: 1 }));

    await user.keyboard('d');
    expect(search).toHaveFocus();
    expect(search).toHaveAccessibleDescription(drawSearchHint);
    await user.tab();
    expect(screen.queryByText(drawSearchHint)).not.toBeInTheDocument();
  });

  it('when d is pressed on a container page, then the draw form takes the cursor', async () => {
    setup();
    const user = userEvent.setup();
    renderApp(paths.stockContainer(42));
    const form = await screen.findByRole('form', { name: 'Record a draw' });
    await shortcutsListening();
    await user.keyboard('d');
    const focused = document.activeElement;
    expect(form.contains(focused)).toBe(true);
    expect(focused).not.toHaveAttribute('type', 'radio');
  });

  it('when r is pressed on a plan or procedure, then the run is opened for it', () => {
    expect(runStartFor('/preparations/plans/7')).toBe('/preparations/runs/new?planId=7');
    expect(runStartFor('/preparations/procedures/3')).toBe('/preparations/runs/new?procedureId=3');
    expect(runStartFor('/preparations/plans/new')).toBe(paths.runNew);
    expect(runStartFor('/stock')).toBe(paths.runNew);
  });
});
