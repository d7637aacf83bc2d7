import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { orderDetailSchema, safetyDeferral } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { makeOrderDetail, makeShare } from '../test-factories';

const member = makeUser({ id: 7, role: 'member', displayName: 'Robin Vale' });
const coordinator = makeUser({ id: 2, role: 'manager', displayName: 'Sam Okafor' });

afterEach(() => {
  vi.unstubAllGlobals();
});

/** Claims closed: the member's share is fixed at €32.10 and may be paid. */
const payable = makeOrderDetail({
  claimsOpen: false,
  paymentsOpen: true,
  claimsClosedAt: '2026-12-20T18:00:00.000Z',
  unclaimedMinor: 0,
  owedMinor: 9735,
  mine: { shareCount: 1, amountMinor: 3210, amountFixed: true, owedMinor: 3210 },
  shares: [
    makeShare({ amountMinor: 3210, amountFixed: true, mayEdit: false, mayPay: true }),
    makeShare({
      id: 32,
      member: null,
      forLab: true,
      mine: false,
      quantity: 750,
      amountMinor: 6525,
      amountFixed: true,
      mayEdit: false,
    }),
  ],
  abilities: { ...makeOrderDetail().abilities, mayClaim: false },
});

describe('Order page', () => {
  it('when a member opens an order with claims open, then lines show with hazards, totals come from the server and the claim is sent as typed', async () => {
    expect(orderDetailSchema.safeParse(makeOrderDetail()).success).toBe(true);
    const claimed = makeOrderDetail({
      shares: [makeShare({ quantity: 350, amountMinor: 1964 })],
      mine: { shareCount: 1, amountMinor: 1964, amountFixed: false, owedMinor: 0 },
    });
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/orders/4': { body: makeOrderDetail() },
      'POST /api/orders/4/shares': { status: 201, body: claimed },
    });
    renderApp('/orders/4');

    expect(
      await screen.findByRole('heading', { name: 'Autumn club order' }, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(screen.getByText('Open for claims')).toBeInTheDocument();
    expect(screen.getByText('By value of each share')).toBeInTheDocument();
    expect(screen.getAllByText(safetyDeferral).length).toBeGreaterThan(0);
    const line = screen.getByTestId('order-line-11');
    expect(within(line).getByText('Potassium nitrate')).toBeInTheDocument();
    expect(within(line).getByText(/May intensify fire; oxidizer/)).toBeInTheDocument();
    expect(within(line).getByText('750.00 g')).toBeInTheDocument();

    expect(screen.getByTestId('total')).toHaveTextContent('€97.35');
    expect(screen.getByTestId('total-goods')).toHaveTextContent('€76.63');
    expect(screen.getByTestId('total-hazardous')).toHaveTextContent('€7.77');
    expect(screen.getByTestId('total-unclaimed')).toHaveTextContent('€83.32');

    const panel = screen.getByRole('region', { name: 'Your share' });
    expect(within(panel).getByText(/estimate: it moves as others claim/)).toBeInTheDocument();
    const form = within(panel).getByRole('form', { name: 'Claim a share' });
    await userEvent.type(within(form).getByLabelText('Quantity (g)'), '100');
    await userEvent.click(within(form).getByRole('button', { name: 'Claim' }));

    await waitFor(() => expect(screen.getByTestId('my-share-31')).toHaveTextContent('350.00 g'));
    expect(screen.getByTestId('my-share-31')).toHaveTextContent('€19.64');
    const post = requests.find((r) => r.method === 'POST');
    expect(post?.body).toEqual({ lineId: 11, quantity: 100 });
  });

  it('when a claim is more than what remains, then the server’s 409 message is shown', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/orders/4': { body: makeOrderDetail() },
      'POST /api/orders/4/shares': {
        status: 409,
        body: {
          error: {
            code: 'conflict',
            message: 'Only 750.00 g of this line remains unclaimed; you asked for 800.00 g more.',
          },
        },
      },
    });
    renderApp('/orders/4');
    const form = await screen.findByRole('form', { name: 'Claim a share' }, { timeout: 5000 });
    await userEvent.type(within(form).getByLabelText('Quantity (g)'), '800');
    // the browser's own max check would stop this; the server's answer is what is tested
    within(form).getByLabelText('Quantity (g)').removeAttribute('max');
    await userEvent.click(within(form).getByRole('button', { name: 'Claim' }));
    expect(
      await screen.findByText(/Only 750\.00 g of this line remains unclaimed/),
    ).toBeInTheDocument();
  });

  it('when claims are closed, then "Pay" starts a checkout and the browser goes to the provider', async () => {
    const assign = vi.fn();
    vi.stubGlobal('location', { ...window.location, assign });
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/orders/4': { body: payable },
      'POST /api/orders/4/shares/31/checkout': {
        body: { url: 'http://127.0.0.1:4343/checkout/cs_test_1' },
      },
    });
    renderApp('/orders/4');
    const pay = await screen.findByRole('button', { name: 'Pay €32.10' }, { timeout: 5000 });
    expect(screen.getByTestId('my-total')).toHaveTextContent('still to pay €32.10');
    await userEvent.click(pay);
    await waitFor(() =>
      expect(assign).toHaveBeenCalledWith('http://127.0.0.1:4343/checkout/cs_test_1'),
    );
    expect(requests.some((r) => r.method === 'POST' && r.url.pathname.endsWith('/checkout'))).toBe(
      true,
    );
  });

  it('when the member comes back from paying, then the page says the payment awaits confirmation and reads again until the share is paid', async () => {
    let calls = 0;
    const paid = {
      ...payable,
      shares: [
        makeShare({
          amountMinor: 3210,
          amountFixed: true,
          mayEdit: false,
          paymentStatus: 'paid',
          paidMinor: 3210,
        }),
        payable.shares[1]!,
      ],
    };
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/orders/4': () => ({ body: ++calls < 2 ? payable : paid }),
    });
    renderApp('/orders/4?paid=31');
    expect(
      await screen.findByText(
        'Payment received — it shows as paid once the provider confirms',
        {},
        { timeout: 5000 },
      ),
    ).toBeInTheDocument();
    expect(
      await screen.findByText(
        'Your payment is confirmed; the share reads paid.',
        {},
        { timeout: 6000 },
      ),
    ).toBeInTheDocument();
    expect(calls).toBe(2);
  });

  it('when the member left the checkout, then the page says nothing was charged', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: member } },
      'GET /api/orders/4': { body: payable },
    });
    renderApp('/orders/4?cancelled=31');
    expect(
      await screen.findByText(/nothing was charged/, {}, { timeout: 5000 }),
    ).toBeInTheDocument();
  });

  it('when the coordinator cancels, then the dialog asks first and sends the reason', async () => {
    const managed = makeOrderDetail({
      abilities: {
        ...makeOrderDetail().abilities,
        mayManage: true,
        mayCancel: true,
        mayCloseClaims: true,
        mayTakeRemainder: true,
      },
    });
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: coordinator } },
      'GET /api/orders/4': { body: managed },
      'POST /api/orders/4/cancel': {
        body: {
          ...managed,
          status: 'cancelled',
          cancelReason: 'Supplier out of stock',
          abilities: { ...managed.abilities, mayCancel: false },
        },
      },
    });
    renderApp('/orders/4');
    await userEvent.click(
      await screen.findByRole('button', { name: 'Cancel order' }, { timeout: 5000 }),
    );
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
    await userEvent.type(screen.getByLabelText('Reason'), 'Supplier out of stock');
    await userEvent.click(screen.getByRole('button', { name: 'Cancel the order' }));
    await waitFor(() => expect(screen.getByText('This order was cancelled')).toBeInTheDocument());
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      reason: 'Supplier out of stock',
    });
  });

  it('when the coordinator closes claims while a rest is unclaimed, then the server’s reason shows and the rest can be taken for the lab', async () => {
    const managed = makeOrderDetail({
      abilities: {
        ...makeOrderDetail().abilities,
        mayManage: true,
        mayCloseClaims: true,
        mayTakeRemainder: true,
        mayEditLines: true,
      },
    });
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: coordinator } },
      'GET /api/orders/4': { body: managed },
      'POST /api/orders/4/close-claims': {
        status: 409,
        body: {
          error: {
            code: 'conflict',
            message:
              'Claims cannot close while part of the order is unclaimed (750.00 g of Potassium nitrate (NR-KNO3-500)). Take the rest for the lab, or reduce the packs.',
          },
        },
      },
      'POST /api/orders/4/lab-remainder': {
        body: {
          ...managed,
          unclaimedMinor: 0,
          abilities: { ...managed.abilities, mayTakeRemainder: false },
        },
      },
      'PATCH /api/orders/4/lines/12': { body: managed },
    });
    renderApp('/orders/4');
    await userEvent.click(
      await screen.findByRole('button', { name: 'Close claims' }, { timeout: 5000 }),
    );
    await userEvent.click(screen.getByRole('button', { name: 'Close claims and fix amounts' }));
    expect(
      await screen.findByText(/Take the rest for the lab, or reduce the packs/),
    ).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Cancel' }));

    const packs = screen.getByLabelText('Packs of Ethanol');
    await userEvent.clear(packs);
    await userEvent.type(packs, '1');
    await userEvent.click(
      within(screen.getByTestId('order-line-12')).getByRole('button', { name: 'Set packs' }),
    );
    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ packs: 1 }),
    );

    await userEvent.click(screen.getByRole('button', { name: 'Take the rest for the lab' }));
    await waitFor(() => expect(screen.getByTestId('total-unclaimed')).toHaveTextContent('€0.00'));
    expect(
      screen.queryByRole('button', { name: 'Take the rest for the lab' }),
    ).not.toBeInTheDocument();
  });

  it('when a draft has no deadline, then the coordinator sets one and opens the order', async () => {
    const draft = makeOrderDetail({
      status: 'draft',
      claimDeadline: null,
      claimsOpen: false,
      shares: [],
      abilities: {
        ...makeOrderDetail().abilities,
        mayClaim: false,
        mayManage: true,
        mayEditDraft: true,
        mayEditLines: true,
        mayOpen: true,
        mayCancel: true,
      },
    });
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: coordinator } },
      'GET /api/orders/4': { body: draft },
      'PATCH /api/orders/4': ({ body }) => ({
        body: { ...draft, claimDeadline: (body as { claimDeadline: string }).claimDeadline },
      }),
      'POST /api/orders/4/open': {
        body: {
          ...draft,
          status: 'open',
          claimsOpen: true,
          claimDeadline: '2026-12-24',
          abilities: { ...draft.abilities, mayOpen: false, mayClaim: true },
        },
      },
    });
    renderApp('/orders/4');
    expect(
      await screen.findByText('No deadline set yet', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
    await userEvent.type(screen.getByLabelText('Claim deadline'), '2026-12-24');
    await userEvent.click(screen.getByRole('button', { name: 'Set deadline' }));
    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({
        claimDeadline: '2026-12-24',
      }),
    );
    await userEvent.click(screen.getByRole('button', { name: 'Open for claims' }));
    await waitFor(() =>
      expect(screen.queryByRole('button', { name: 'Open for claims' })).not.toBeInTheDocument(),
    );
    expect(screen.getByText('Open for claims')).toBeInTheDocument();
    expect(screen.getByRole('form', { name: 'Claim a share' })).toBeInTheDocument();
  });
});
