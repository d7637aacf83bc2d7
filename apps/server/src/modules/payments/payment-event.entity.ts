import { EntitySchema } from 'typeorm';

/**
 * A row of `payment_events`: a webhook event from the payment provider, stored by its id when
 * it is handled, so a replay of the same event changes nothing a second time.
 */
export interface PaymentEventRow {
  /** The provider's event id (`evt_…`). */
  id: string;
  type: string;
  /** What handling the event did, in words, for the audit of payments. */
  outcome: string;
  receivedAt: string;
}

export const PaymentEventEntity = new EntitySchema<PaymentEventRow>({
  name: 'PaymentEvent',
  tableName: 'payment_events',
  columns: {
    id: { type: 'varchar', length: 120, primary: true },
    type: { type: 'varchar', length: 80 },
    outcome: { type: 'text' },
    receivedAt: { name: 'received_at', type: 'varchar', length: 24 },
  },
});
