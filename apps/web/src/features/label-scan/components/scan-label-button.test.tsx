import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeContainer, makeLedgerEntry, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const member = makeUser({ role: 'member' });
const acetone = makeContainer({ id: 42, labelCode: 'LW-00042' });
const imported = makeContainer({ id: 43, labelCode: 'FW/B-117' });

function routes() {
  return mockFetch({
    'GET /api/auth/me': { body: { user: member } },
    'GET /api/settings/public': { body: { publicUrl: 'https://lab.example.test' } },
    'GET /api/containers/by-label/LW-00042': { body: acetone },
    'GET /api/containers/by-label/FW%2FB-117': { body: imported },
    'GET /api/containers/42': { body: acetone },
    'GET /api/containers/43': { body: imported },
    'GET /api/containers/42/ledger': { body: page([makeLedgerEntry({ containerId: 42 })]) },
    'GET /api/containers/43/ledger': { body: page([makeLedgerEntry({ containerId: 43 })]) },
    'GET /api/stock/overview': { body: page([]) },
  });
}

/** The browser's camera, refusing: the page never gets a picture. */
function cameraRefused() {
  vi.stubGlobal('navigator', {
    ...navigator,
    mediaDevices: {
      getUserMedia: () => Promise.reject(new DOMException('Permission denied', 'NotAllowedError')),
      enumerateDevices: () => Promise.resolve([{ kind: 'videoinput' }]),
    },
  });
}

async function openScanner() {
  const user = userEvent.setup();
  const button = await screen.findByRole('button', { name: 'Scan a label' }, { timeout: 5000 });
  await user.click(button);
  const dialog = await screen.findByRole('dialog', { name: 'Scan a label' });
  return { user, dialog };
}

beforeEach(cameraRefused);
afterEach(() => vi.unstubAllGlobals());

describe('Scan a label', () => {
  it('when the camera is refused, then it says how to allow it, and a typed code opens the container ready to draw', async () => {
    routes();
    const { router } = renderApp('/stock/containers');
    const { user, dialog } = await openScanner();

    // Over the camera frame and in the notice below it.
    expect(await within(dialog).findAllByText('The camera is blocked for Lotwise')).toHaveLength(2);
    expect(within(dialog).getByText(/set Camera to Allow/)).toBeInTheDocument();
    expect(within(dialog).getByRole('button', { name: 'Try again' })).toBeInTheDocument();

    await user.type(within(dialog).getByLabelText('Or type the code on the label'), 'lw-42');
    await user.click(within(dialog).getByRole('button', { name: 'Open' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/stock/containers/42'));
    expect(router.state.location.hash).toBe('#draw');
    expect(screen.queryByRole('dialog', { name: 'Scan a label' })).not.toBeInTheDocument();
    const amount = await screen.findByRole('textbox', { name: /^(Gross mass now|Amount taken)/ });
    await waitFor(() => expect(amount).toHaveFocus());
  });

  it('when another lab’s label, an unknown code or a non-Lotwise QR is read, then it says so and stays open', async () => {
    routes();
    renderApp('/stock/containers');
    const { user, dialog } = await openScanner();
    const field = within(dialog).getByLabelText('Or type the code on the label');
    const open = within(dialog).getByRole('button', { name: 'Open' });

    await user.type(field, 'https://other-lab.example.test/stock/c/LW-00042');
    await user.click(open);
    expect(
      await within(dialog).findByText(
        /belongs to another lab \(https:\/\/other-lab\.example\.test\)/,
      ),
    ).toBeInTheDocument();

    await user.clear(field);
    await user.type(field, 'LW-00999');
    await user.click(open);
    expect(
      await within(dialog).findByText(/No container in this lab has the label LW-00999/),
    ).toBeInTheDocument();

    await user.clear(field);
    await user.type(field, 'https://example.test/menu');
    await user.click(open);
    expect(await within(dialog).findByText(/not a Lotwise label/)).toBeInTheDocument();
    expect(screen.getByRole('dialog', { name: 'Scan a label' })).toBeInTheDocument();
  });

  it('when this lab’s label of an imported container is read, then that container opens', async () => {
    routes();
    const { router } = renderApp('/stock/containers');
    const { user, dialog } = await openScanner();
    await user.type(
      within(dialog).getByLabelText('Or type the code on the label'),
      'https://lab.example.test/stock/c/FW%2FB-117',
    );
    await user.click(within(dialog).getByRole('button', { name: 'Open' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/stock/containers/43'));
  });

  // Escape is the browser's own close of a modal <dialog>: the e2e scan spec presses it.
  it('when Close is pressed, then the camera view closes', async () => {
    routes();
    renderApp('/stock/containers');
    const { user, dialog } = await openScanner();
    await user.click(within(dialog).getByRole('button', { name: 'Close' }));
    await waitFor(() =>
      expect(screen.queryByRole('dialog', { name: 'Scan a label' })).not.toBeInTheDocument(),
    );
  });
});
