import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import {
  roomRulesReminder,
  type RuleSet,
  type WasteArea,
  type WasteContainerDetail,
} from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { listedPlace } from '../../lab-areas/test/room-rules-fixtures';

const manager = makeUser({ role: 'manager' });
const stamp = '2026-11-01T08:00:00.000Z';

/** The built-in waste-accumulation set as the server answers it. */
const epaSet: RuleSet = {
  id: 5,
  name: 'Satellite accumulation limits',
  source: 'US EPA, 40 CFR',
  edition: '',
  reference: '§262.15',
  notes: '',
  builtIn: true,
  citation: 'US EPA, 40 CFR, §262.15',
  createdAt: stamp,
  updatedAt: stamp,
  kind: 'waste-accumulation',
  data: {
    // 40 CFR 262.15(a): 55 gallons hazardous, 1 quart acutely hazardous, 3 days once over; from memory.
    maxHazardous: { value: 55, unit: 'gal' },
    maxAcutelyHazardous: { value: 1, unit: 'qt' },
    daysAllowedOnceExceeded: 3,
    maxAccumulationDays: null,
    nearFraction: 0.9,
  },
};

/** An invented set of a lab's own. */
const campusSet: RuleSet = {
  ...epaSet,
  id: 6,
  name: 'Campus waste rules',
  source: 'Campus safety office',
  edition: '2026',
  reference: 'Section 4',
  builtIn: false,
  citation: 'Campus safety office (2026), Section 4',
};

const created: WasteContainerDetail = {
  kind: 'waste',
  id: 41,
  labelCode: 'LW-W00041',
  title: 'Halogenated solvent washings',
  locationId: 10,
  locationPath: 'Room 204',
  capacity: 4,
  capacityUnit: 'L',
  filled: 0,
  fillFraction: 0,
  form: 'liquid',
  characteristics: ['ignitable', 'toxic'],
  acutelyHazardous: false,
  liquidClass: null,
  liquidClassNote: null,
  accumulationStartOn: null,
  ageDays: null,
  status: 'open',
  pickupId: null,
  notes: '',
  createdAt: stamp,
  updatedAt: stamp,
  additions: [],
  chemicals: [],
  ghsPictograms: [],
};

const station: WasteArea = {
  locationId: 12,
  locationPath: 'Room 102 › Waste station',
  ruleSetId: 5,
  ruleSetName: epaSet.name,
  citation: epaSet.citation,
  hazardous: { litres: 3, limitLitres: 208.2, fraction: 0.014 },
  acutelyHazardous: { litres: 0, limitLitres: 0.95, fraction: 0 },
  daysAllowedOnceExceeded: 3,
  maxAccumulationDays: null,
  nearFraction: 0.9,
  state: 'ok',
  containers: [],
  reminder: roomRulesReminder,
};

function wastePageRoutes(areas: WasteArea[] = []) {
  return {
    'GET /api/auth/me': { body: { user: manager } },
    'GET /api/waste-areas': { body: areas },
    'GET /api/waste-containers': { body: [] },
    'GET /api/waste-pickups': { body: [] },
    'GET /api/locations': {
      body: page([
        listedPlace(),
        listedPlace({ id: 12, name: 'Waste station', path: 'Room 102 › Waste station' }),
      ]),
    },
    'GET /api/rule-sets': { body: { items: [epaSet, campusSet] } },
  };
}

describe('a new waste container', () => {
  it('when a manager fills in the form, then it sends what was entered and opens the new container', async () => {
    const { requests } = mockFetch({
      ...wastePageRoutes(),
      'POST /api/waste-containers': { status: 201, body: created },
      'GET /api/waste-containers/41': { body: created },
    });
    const user = userEvent.setup();
    const { router } = renderApp('/stock/waste');

    await user.click(
      await screen.findByRole('button', { name: 'New waste container' }, { timeout: 5000 }),
    );
    const dialog = await screen.findByRole('dialog', { name: 'New waste container' });
    await user.type(
      within(dialog).getByRole('textbox', { name: 'What it collects' }),
      'Halogenated solvent washings',
    );
    const place = within(dialog).getByRole('combobox', { name: 'Where it stands' });
    await waitFor(() => expect(place).toBeEnabled());
    await user.selectOptions(place, 'Room 204');
    await user.type(within(dialog).getByRole('textbox', { name: 'Capacity' }), '4');
    await user.click(within(dialog).getByRole('checkbox', { name: /Toxic/ }));
    await user.click(within(dialog).getByRole('checkbox', { name: /Ignitable/ }));
    expect(dialog).toHaveTextContent('flash point below 60 °C');
    await user.click(within(dialog).getByRole('button', { name: 'Add the container' }));

    await waitFor(() =>
      expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
        title: 'Halogenated solvent washings',
        locationId: 10,
        capacity: 4,
        capacityUnit: 'L',
        form: 'liquid',
        characteristics: ['ignitable', 'toxic'],
        acutelyHazardous: false,
        accumulationStartOn: null,
        notes: '',
      }),
    );
    await waitFor(() => expect(router.state.location.pathname).toBe('/stock/waste/41'));
  });

  it('when the server refuses a field, then its message shows at that field and nothing typed is lost', async () => {
    mockFetch({
      ...wastePageRoutes(),
      'POST /api/waste-containers': {
        status: 422,
        body: {
          error: {
            code: 'validation_failed',
            message: 'Check the marked fields.',
            fields: { capacity: 'must be at most 1000 L' },
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/waste');

    await user.click(
      await screen.findByRole('button', { name: 'New waste container' }, { timeout: 5000 }),
    );
    const dialog = await screen.findByRole('dialog', { name: 'New waste container' });
    await user.type(within(dialog).getByRole('textbox', { name: 'What it collects' }), 'Acids');
    const place = within(dialog).getByRole('combobox', { name: 'Where it stands' });
    await waitFor(() => expect(place).toBeEnabled());
    await user.selectOptions(place, 'Room 204');
    await user.type(within(dialog).getByRole('textbox', { name: 'Capacity' }), '5000');
    await user.click(within(dialog).getByRole('button', { name: 'Add the container' }));

    expect(await within(dialog).findByText('Capacity must be at most 1000 L')).toBeVisible();
    expect(within(dialog).getByRole('textbox', { name: 'Capacity' })).toHaveAccessibleDescription(
      /Capacity must be at most 1000 L/,
    );
    expect(within(dialog).getByRole('alert')).toHaveTextContent('Nothing was saved');
    expect(within(dialog).getByRole('textbox', { name: 'What it collects' })).toHaveValue('Acids');
  });
});

describe('waste accumulation areas', () => {
  it('when a manager marks a place, then the rule set shows its citation and the place and set are sent', async () => {
    const { requests } = mockFetch({
      ...wastePageRoutes(),
      'PUT /api/waste-areas/10': { body: [] },
    });
    const user = userEvent.setup();
    renderApp('/stock/waste');

    await user.click(
      await screen.findByRole(
        'button',
        { name: 'Mark a place as a waste accumulation area' },
        { timeout: 5000 },
      ),
    );
    const dialog = await screen.findByRole('dialog', {
      name: 'Mark a place as a waste accumulation area',
    });
    await waitFor(() => expect(dialog).toHaveTextContent('Limits from US EPA, 40 CFR, §262.15.'));
    const place = within(dialog).getByRole('combobox', { name: 'Place' });
    await waitFor(() => expect(place).toBeEnabled());
    await user.selectOptions(place, 'Room 204');
    await user.selectOptions(
      within(dialog).getByRole('combobox', { name: 'Accumulation limits' }),
      'Campus waste rules — Campus safety office (2026), Section 4',
    );
    expect(dialog).toHaveTextContent('Limits from Campus safety office (2026), Section 4.');
    await user.click(within(dialog).getByRole('button', { name: 'Mark as an accumulation area' }));

    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PUT')).toMatchObject({
        url: expect.objectContaining({ pathname: '/api/waste-areas/10' }),
        body: { ruleSetId: 6 },
      }),
    );
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
  });

  it('when the server refuses the rule set, then its message shows at that field', async () => {
    mockFetch({
      ...wastePageRoutes([station]),
      'PUT /api/waste-areas/12': {
        status: 422,
        body: {
          error: {
            code: 'validation_failed',
            message: 'Check the marked fields.',
            fields: { ruleSetId: 'is not a waste-accumulation rule set' },
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/waste');

    await user.click(
      await screen.findByRole(
        'button',
        { name: 'Change the rule set of Room 102 › Waste station' },
        { timeout: 5000 },
      ),
    );
    const dialog = await screen.findByRole('dialog', {
      name: 'Change the rules of Room 102 › Waste station',
    });
    await user.click(within(dialog).getByRole('button', { name: 'Save changes' }));

    expect(
      await within(dialog).findByText('Rule set is not a waste-accumulation rule set'),
    ).toBeVisible();
    expect(within(dialog).getByRole('alert')).toHaveTextContent('Nothing was saved');
  });

  it('when a manager unmarks an area, then Lotwise asks first and only then sends it', async () => {
    const { requests } = mockFetch({
      ...wastePageRoutes([station]),
      'DELETE /api/waste-areas/12': { status: 204 },
    });
    const user = userEvent.setup();
    renderApp('/stock/waste');

    await user.click(
      await screen.findByRole(
        'button',
        { name: 'Unmark Room 102 › Waste station as an accumulation area' },
        { timeout: 5000 },
      ),
    );
    const dialog = await screen.findByRole('dialog', {
      name: 'Unmark Room 102 › Waste station as an accumulation area?',
    });
    expect(requests.some((r) => r.method === 'DELETE')).toBe(false);
    await user.click(within(dialog).getByRole('button', { name: 'Unmark' }));

    await waitFor(() =>
      expect(requests.find((r) => r.method === 'DELETE')?.url.pathname).toBe('/api/waste-areas/12'),
    );
  });
});

describe('who may change waste', () => {
  it('when a viewer opens the waste page, then it offers no new container and no area changes', async () => {
    mockFetch({
      ...wastePageRoutes([station]),
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
    });
    renderApp('/stock/waste');

    expect(
      await screen.findByRole('heading', { name: /Room 102 › Waste station/ }, { timeout: 5000 }),
    ).toBeVisible();
    expect(screen.queryByRole('button', { name: 'New waste container' })).not.toBeInTheDocument();
    expect(
      screen.queryByRole('button', { name: 'Mark a place as a waste accumulation area' }),
    ).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Unmark/ })).not.toBeInTheDocument();
  });
});
