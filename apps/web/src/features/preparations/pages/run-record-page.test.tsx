import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { RunRecord } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeContainer, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import {
  makeAspirinProcedure,
  makePlanDetail,
  makeRun,
  makeStockLine,
  display,
} from '../test-factories';

const member = makeUser({ role: 'member' });
const procedure = makeAspirinProcedure();
const salicylicBottle = makeContainer({
  id: 14,
  labelCode: 'LW-00014',
  quantity: 30.5,
  unit: 'g',
  tareMass: 148.5,
});
const anhydrideBottle = makeContainer({
  id: 13,
  labelCode: 'LW-00013',
  quantity: 240,
  unit: 'mL',
  tareMass: 310,
});
const shelf = {
  id: 5,
  name: 'Shelf A',
  kind: 'shelf' as const,
  parentId: 1,
  path: 'Room 102 › Shelf A',
  depth: 1,
  storageGroups: [],
  notes: '',
  flammableStorage: null,
  containerCount: 4,
  childCount: 0,
  createdAt: '2026-08-01T08:00:00.000Z',
  updatedAt: '2026-08-01T08:00:00.000Z',
};

// worked example, calc from CIAAW 2021: theoretical 2.6087 g; 2.10 g in two crops = 80.50 %.
const recorded = makeRun({
  status: 'recorded',
  performedOn: '2026-12-02',
  theoreticalYieldG: 2.6087,
  crudeMassG: 2.45,
  productMassG: 2.1,
  percentYield: 80.5,
  crudePercentYield: 93.92,
  portions: [
    {
      id: 1,
      lineIndex: 2,
      label: 'first crop',
      lotId: 50,
      containerId: 80,
      labelCode: 'LW-00080',
      locationPath: shelf.path,
      chemicalId: 8,
      chemicalName: 'Acetylsalicylic acid',
      quantity: 1.8,
      unit: 'g',
      massG: 1.8,
      percentYield: 69.0,
    },
    {
      id: 2,
      lineIndex: 2,
      label: 'second crop (from the mother liquor)',
      lotId: 51,
      containerId: 81,
      labelCode: 'LW-00081',
      locationPath: shelf.path,
      chemicalId: 8,
      chemicalName: 'Acetylsalicylic acid',
      quantity: 0.3,
      unit: 'g',
      massG: 0.3,
      percentYield: 11.5,
    },
  ],
});

describe('Recording a run', () => {
  // Types into a dozen fields: allowed longer than the default on a busy machine.
  it(
    'when the bottle is weighed before and after and two crops are put into stock, then the gross masses and both crops are sent, and the yield and new labels are shown',
    { timeout: 30_000 },
    async () => {
      let answered = makeRun();
      const { requests } = mockFetch({
        'GET /api/auth/me': { body: { user: member } },
        'GET /api/runs/12': () => ({ body: answered }),
        'GET /api/procedures/1': { body: procedure },
        'GET /api/procedures/1/runs': {
          body: {
            procedure: { id: 1, title: procedure.title, expectedYieldPercent: 80 },
            runs: [],
            stats: {
              count: 0,
              purifiedCount: 0,
              meanPercentYield: null,
              minPercentYield: null,
              maxPercentYield: null,
              aboveHundredCount: 0,
              crude: {
                count: 0,
                meanPercentYield: null,
                minPercentYield: null,
                maxPercentYield: null,
                aboveHundredCount: 0,
              },
            },
          },
        },
        'GET /api/containers': (request) => ({
          body: page(
            request.url.searchParams.get('chemicalId') === '7'
              ? [salicylicBottle]
              : [anhydrideBottle],
          ),
        }),
        'GET /api/locations': { body: page([shelf]) },
        'GET /api/waste-containers': { body: [] },
        'POST /api/runs/12/record': () => {
          answered = recorded;
          return { body: recorded };
        },
      });
      const user = userEvent.setup();
      renderApp('/preparations/runs/12/record');

      const first = await screen.findByRole('group', { name: 'Line 1 draw 1' }, { timeout: 5000 });
      await user.selectOptions(await within(first).findByLabelText('Container'), '14');
      await user.click(within(first).getByLabelText('Weighed the container'));
      expect(within(first).getByText(/Tare \(empty, cap on\): 148.50 g/)).toBeInTheDocument();
      await user.type(within(first).getByLabelText(/Gross mass before/), '180.00');
      await user.type(within(first).getByLabelText(/Gross mass after/), '178.00');
      // 180.00 − 178.00: the tare cancels out.
      expect(within(first).getByTestId('weighing-preview')).toHaveTextContent('2.00 g');

      const second = screen.getByRole('group', { name: 'Line 2 draw 1' });
      // Without a plan the planned amount is filled in, and said so; the container is chosen.
      expect(within(second).getByLabelText('Amount')).toHaveValue('5');
      expect(screen.getByTestId('draw-source-1')).toHaveTextContent(
        'Choose the container it came from',
      );
      await user.selectOptions(await within(second).findByLabelText('Container'), '13');
      await user.clear(within(second).getByLabelText('Amount'));
      await user.type(within(second).getByLabelText('Amount'), '5.0');

      await user.type(screen.getByLabelText(/Crude mass/), '2.45');
      const crop1 = screen.getByRole('listitem', { name: 'Portion 1' });
      await user.type(within(crop1).getByLabelText('Amount'), '1.80');
      await user.selectOptions(await within(crop1).findByLabelText('Location'), '5');
      await user.click(screen.getByRole('button', { name: 'Add a second crop' }));
      const crop2 = screen.getByRole('listitem', { name: 'Portion 2' });
      await user.type(within(crop2).getByLabelText('Amount'), '300');
      await user.selectOptions(within(crop2).getByLabelText('Unit'), 'mg');
      await user.type(screen.getByLabelText(/Melting range from/), '134');
      await user.type(screen.getByLabelText(/Melting range to/), '136');

      await user.click(screen.getByRole('button', { name: 'Record the run' }));

      expect(
        await screen.findByText('Run #12 is recorded', {}, { timeout: 5000 }),
      ).toBeInTheDocument();
      const body = requests.find((r) => r.method === 'POST')!.body as RunRecord;
      expect(body.lines).toEqual([
        {
          lineIndex: 0,
          draws: [
            { containerId: 14, grossMassBefore: 180, grossMassAfter: 178, unit: 'g', note: '' },
          ],
        },
        { lineIndex: 1, draws: [{ containerId: 13, amount: 5, unit: 'mL', note: '' }] },
      ]);
      expect(body.products).toEqual([
        {
          lineIndex: 2,
          crudeMassG: 2.45,
          portions: [
            {
              label: 'first crop',
              quantity: 1.8,
              unit: 'g',
              locationId: 5,
              tareMass: null,
              notes: '',
            },
            {
              label: 'second crop (from the mother liquor)',
              quantity: 300,
              unit: 'mg',
              locationId: 5,
              tareMass: null,
              notes: '',
            },
          ],
        },
      ]);
      expect(body.observations?.meltingRangeC).toEqual({ low: 134, high: 136 });

      expect(screen.getByTestId('percent-yield')).toHaveTextContent('80.5 %');
      expect(screen.getByRole('link', { name: 'LW-00080' })).toHaveAttribute(
        'href',
        '/stock/containers/80',
      );
      expect(screen.getByRole('link', { name: 'LW-00081' })).toBeInTheDocument();
      expect(screen.getByRole('link', { name: 'Print labels' })).toHaveAttribute(
        'href',
        '/stock/labels?ids=80%2C81',
      );
      expect(screen.queryByText(/probably wet or impure/)).not.toBeInTheDocument();
    },
  );

  it('when the run comes from a plan, then each required line is filled in from the held or suggested container, shown as such, and exactly that is sent to be drawn', async () => {
    // Plan: 4 benches at 1/2 scale; the run is the session, factor 2. Salicylic acid: 1 g a
    // bench at 1/2 -> 4 g at factor 2, held in LW-00014; acetic anhydride 2.5 mL -> 10 mL,
    // suggested from LW-00013.
    const plan = makePlanDetail({
      id: 2,
      procedure: { id: 1, title: procedure.title },
      scaleFactor: 0.5,
      benches: 4,
      status: 'reserved',
      stockCheck: {
        asOf: '2026-12-10',
        ok: true,
        shortCount: 0,
        benchesServed: 4,
        rule: 'Counted: usable containers.',
        lines: [
          makeStockLine({
            index: 0,
            lineIndex: 0,
            role: 'limiting-reagent',
            chemical: {
              id: 7,
              name: 'Salicylic acid',
              stockUnit: 'g',
              density: null,
              defaultPurityPercent: 100,
            },
            unit: 'g',
            perBench: 1,
            perBenchDisplay: display(1, 'g'),
            take: [],
          }),
          makeStockLine({
            index: 1,
            lineIndex: 1,
            chemical: {
              id: 6,
              name: 'Acetic anhydride',
              stockUnit: 'mL',
              density: 1.082,
              defaultPurityPercent: 100,
            },
            perBench: 2.5,
            perBenchDisplay: display(2.5, 'mL'),
            take: [
              { ...makeStockLine().take[0]!, containerId: 13, labelCode: 'LW-00013', take: 11 },
            ],
          }),
        ],
      },
      reservations: [
        {
          id: 1,
          planId: 2,
          containerId: 14,
          labelCode: 'LW-00014',
          chemicalId: 7,
          chemicalName: 'Salicylic acid',
          locationPath: shelf.path,
          requirementIndex: 0,
          quantity: 4.4,
          reservedQuantity: 4.4,
          unit: 'g',
          until: '2026-12-10',
          status: 'active',
          releasedReason: null,
          releasedAt: null,
          createdAt: '2026-12-01T08:00:00.000Z',
        },
      ],
    });
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/runs/12': { body: makeRun({ planId: 2, scaleFactor: 2 }) },
      'GET /api/procedures/1': { body: procedure },
      'GET /api/plans/2': { body: plan },
      'GET /api/containers': (request) => ({
        body: page(
          request.url.searchParams.get('chemicalId') === '7'
            ? [salicylicBottle]
            : [anhydrideBottle],
        ),
      }),
      'GET /api/locations': { body: page([shelf]) },
      'POST /api/runs/12/record': { body: recorded },
    });
    const user = userEvent.setup();
    renderApp('/preparations/runs/12/record');

    const first = await screen.findByRole('group', { name: 'Line 1 draw 1' }, { timeout: 5000 });
    expect(within(first).getByLabelText('Amount')).toHaveValue('4');
    expect(screen.getByTestId('draw-source-0')).toHaveTextContent(
      /Filled in from plan #2: 4(\.0+)? g from LW-00014, held for this plan\. Saving draws this from stock/,
    );
    const second = screen.getByRole('group', { name: 'Line 2 draw 1' });
    expect(within(second).getByLabelText('Amount')).toHaveValue('10');
    expect(screen.getByTestId('draw-source-1')).toHaveTextContent(
      /10(\.0+)? mL from LW-00013, as its stock check suggests/,
    );
    const crop = screen.getByRole('listitem', { name: 'Portion 1' });
    await user.type(within(crop).getByLabelText('Amount'), '2.10');
    await user.selectOptions(await within(crop).findByLabelText('Location'), '5');
    await user.click(screen.getByRole('button', { name: 'Record the run' }));

    await screen.findByText('Run #12 is recorded', {}, { timeout: 5000 });
    const body = requests.find((r) => r.method === 'POST')!.body as RunRecord;
    expect(body.lines).toEqual([
      { lineIndex: 0, draws: [{ containerId: 14, amount: 4, unit: 'g', note: '' }] },
      { lineIndex: 1, draws: [{ containerId: 13, amount: 10, unit: 'mL', note: '' }] },
    ]);
  });

  it('when a required line is emptied, then the form refuses before sending and says the yield needs what was drawn', async () => {
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/runs/12': { body: makeRun() },
      'GET /api/procedures/1': { body: procedure },
      'GET /api/containers': (request) => ({
        body: page(
          request.url.searchParams.get('chemicalId') === '7'
            ? [salicylicBottle]
            : [anhydrideBottle],
        ),
      }),
      'GET /api/locations': { body: page([shelf]) },
    });
    const user = userEvent.setup();
    renderApp('/preparations/runs/12/record');

    const second = await screen.findByRole('group', { name: 'Line 2 draw 1' }, { timeout: 5000 });
    await user.click(within(second).getByRole('button', { name: /Remove/ }));
    await user.click(screen.getByRole('button', { name: 'Record the run' }));

    expect(
      await screen.findByText(
        'Line 2 (Acetic anhydride): enter what was drawn and from which container — the yield is worked out only from amounts drawn from stock.',
      ),
    ).toBeInTheDocument();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });
});
