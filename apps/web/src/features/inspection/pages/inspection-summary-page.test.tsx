import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { roomRulesReminder, safetyDeferral, type InspectionSummary } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const summary: InspectionSummary = {
  area: {
    id: 3,
    locationId: 9,
    name: 'Room 7',
    path: 'Room 7',
    kind: 'lab-unit',
    unitClass: 'C',
    floorArea: 40,
    floorAreaUnit: 'm2',
    storey: 2,
    instructional: true,
  },
  date: '2026-12-03',
  generatedAt: '2026-12-03T10:00:00.000Z',
  flammable: {
    ruleSets: [{ id: 1, name: 'NFPA 45', citation: 'NFPA 45 (2024), Table 9.1.1', builtIn: true }],
    status: 'near',
    byClass: [{ liquidClass: 'IB', inStorageLitres: 20, outsideStorageLitres: 2, totalLitres: 22 }],
    limits: [
      {
        key: 'class-i',
        label: 'Class I liquids, cabinets and safety cans included',
        limitLitres: 24,
        heldLitres: 21.5,
        marginLitres: 2.5,
        fractionUsed: 21.5 / 24,
        status: 'near',
        working: [],
      },
    ],
    notCounted: [],
    containerSizeBreaches: [],
  },
  watched: { lists: [], holdings: [] },
  waste: { containers: [], litres: 0, ignitableLitresByClass: {}, accumulationAreas: [] },
  storageConflicts: { items: [], sources: [], notice: safetyDeferral },
  reminder: roomRulesReminder,
};

describe('Inspection summary page', () => {
  it('shows each section with what it was measured against, the margin and the reminder', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/lab-areas/3/inspection': { body: summary },
    });
    renderApp('/stock/lab-areas/3/inspection');

    const page = await screen.findByRole('article', { name: 'Inspection summary' });
    const flammable = within(page).getByRole('region', {
      name: 'Flammable and combustible liquids',
    });
    expect(flammable).toHaveTextContent('Measured against: NFPA 45 (2024), Table 9.1.1');
    expect(flammable).toHaveTextContent('Near a limit');
    expect(within(flammable).getByRole('cell', { name: '2.5 L' })).toBeInTheDocument();
    expect(within(page).getByRole('region', { name: 'Watched chemicals held' })).toHaveTextContent(
      'no watch list is chosen',
    );
    expect(within(page).getByRole('region', { name: 'Waste on hand' })).toHaveTextContent(
      'No open or full waste container',
    );
    expect(within(page).getByRole('region', { name: 'Storage conflicts' })).toHaveTextContent(
      'No place inside this area',
    );
    expect(page).toHaveTextContent(roomRulesReminder);
    expect(screen.getByRole('button', { name: 'Print' })).toBeInTheDocument();
  });

  it('when the area is unknown, then the page says so', async () => {
    mockFetch({ 'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } } });
    renderApp('/stock/lab-areas/99/inspection');
    expect(await screen.findByText('No such lab area')).toBeInTheDocument();
  });
});
