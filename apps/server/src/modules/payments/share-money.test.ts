import { describe, expect, it } from 'vitest';
import type { PaymentRow } from './payment.entity';
import { refundableOf, shareMoney } from './share-money';

let next = 0;
function row(overrides: Partial<PaymentRow>): PaymentRow {
  return {
    id: ++next,
    orderId: 1,
    shareId: 1,
    kind: 'checkout',
    status: 'pending',
    amountMinor: 1234,
    currency: 'EUR',
    attempt: 1,
    idempotencyKey: null,
    providerSessionId: null,
    providerPaymentIntentId: null,
    providerRefundId: null,
    note: '',
    recordedById: null,
    createdAt: '2026-03-01T10:00:00.000Z',
    updatedAt: '2026-03-01T10:00:00.000Z',
    ...overrides,
  };
}

describe('shareMoney', () => {
  it('when nothing was paid, then the share is payable; an open page makes it pending, a page never created does not', () => {
    expect(shareMoney(1234, [])).toEqual({
      paidMinor: 0,
      refundedMinor: 0,
      paymentStatus: 'unpaid',
    });
    expect(shareMoney(1234, [row({})]).paymentStatus).toBe('unpaid');
    expect(shareMoney(1234, [row({ providerSessionId: 'cs_1' })]).paymentStatus).toBe('pending');
    expect(
      shareMoney(1234, [row({ providerSessionId: 'cs_1', status: 'failed' })]).paymentStatus,
    ).toBe('unpaid');
  });

  it('when events arrive in any order, then the same rows give the same answer', () => {
    const rows = [
      row({ status: 'expired', providerSessionId: 'cs_1' }),
      row({ status: 'succeeded', providerSessionId: 'cs_2', attempt: 2 }),
    ];
    expect(shareMoney(1234, rows)).toEqual({
      paidMinor: 1234,
      refundedMinor: 0,
      paymentStatus: 'paid',
    });
    expect(shareMoney(1234, [...rows].reverse())).toEqual(shareMoney(1234, rows));
  });

  it('when everything paid went back, then the share is refunded; a part refund keeps it paid', () => {
    const paid = row({ status: 'succeeded', providerPaymentIntentId: 'pi_1' });
    const full = row({ kind: 'refund', status: 'succeeded', amountMinor: 1234 });
    const part = row({ kind: 'refund', status: 'succeeded', amountMinor: 234 });
    expect(shareMoney(1234, [paid, full]).paymentStatus).toBe('refunded');
    expect(shareMoney(1234, [paid, part])).toEqual({
      paidMinor: 1234,
      refundedMinor: 234,
      paymentStatus: 'paid',
    });
    // a refund still waiting for the provider is not yet money back
    expect(shareMoney(1234, [paid, row({ kind: 'refund', status: 'pending' })]).refundedMinor).toBe(
      0,
    );
  });

  it('when a payment is refunded in parts, then only what is left can be refunded', () => {
    const paid = row({ status: 'succeeded', amountMinor: 1000, providerPaymentIntentId: 'pi_2' });
    const rows = [
      paid,
      row({
        kind: 'refund',
        status: 'succeeded',
        amountMinor: 300,
        providerPaymentIntentId: 'pi_2',
      }),
      row({ kind: 'refund', status: 'pending', amountMinor: 200, providerPaymentIntentId: 'pi_2' }),
      row({ kind: 'refund', status: 'failed', amountMinor: 500, providerPaymentIntentId: 'pi_2' }),
    ];
    expect(refundableOf(paid, rows)).toBe(500);
  });
});
