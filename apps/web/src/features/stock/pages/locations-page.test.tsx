import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { Location } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

function place(overrides: Partial<Location> & Pick<Location, 'id' | 'name' | 'path'>): Location {
  return {
    kind: 'room',
    parentId: null,
    depth: 0,
    storageGroups: [],
    notes: '',
    flammableStorage: null,
    containerCount: 0,
    childCount: 0,
    createdAt: '2026-08-01T08:00:00.000Z',
    updatedAt: '2026-08-01T08:00:00.000Z',
    ...overrides,
  };
}

const room = place({ id: 1, name: 'Room 101', path: 'Room 101', childCount: 1 });
const cabinet = place({
  id: 2,
  name: 'Acids cabinet',
  path: 'Room 101 › Acids cabinet',
  kind: 'cabinet',
  parentId: 1,
  depth: 1,
  storageGroups: ['inorganic-acid', 'organic-acid'],
  containerCount: 4,
});

describe('Locations', () => {
  it('when a viewer looks, then the tree shows places with their storage groups and counts, and no changes are offered', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/locations': { body: page([room, cabinet]) },
    });
    renderApp('/stock/locations');

    const tree = await screen.findByRole('list', { name: 'Locations' }, { timeout: 5000 });
    expect(within(tree).getByRole('link', { name: 'Acids cabinet' })).toBeInTheDocument();
    expect(within(tree).getByText('Mineral acids')).toBeInTheDocument();
    expect(within(tree).getByText(/4 containers here/)).toBeInTheDocument();
    expect(screen.getByRole('navigation', { name: 'Main' })).toHaveTextContent('Stock');
    expect(screen.queryByRole('button', { name: 'Add a room' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Delete/ })).not.toBeInTheDocument();
  });

  it('when a manager deletes a place that still holds containers, then the 409 message shows', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'manager' }) } },
      'GET /api/locations': { body: page([room, cabinet]) },
      'DELETE /api/locations/2': {
        status: 409,
        body: {
          error: {
            code: 'conflict',
            message: 'Room 101 › Acids cabinet still holds 4 containers: move them first.',
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/locations');

    await user.click(
      await screen.findByRole('button', { name: 'Delete Acids cabinet' }, { timeout: 5000 }),
    );
    await user.click(screen.getByRole('button', { name: 'Delete place' }));

    expect(await screen.findByRole('alert')).toHaveTextContent(
      'Room 101 › Acids cabinet still holds 4 containers: move them first.',
    );
  });
});
