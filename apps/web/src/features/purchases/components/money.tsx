import { formatMoney, type PaymentKind } from '@lotwise/shared';
import { cn } from '../../../lib/cn';

/** An amount of minor units in the reader's locale, lined up in columns. */
export function Money({
  minor,
  currency,
  className,
}: {
  minor: number | null | undefined;
  currency: string;
  className?: string;
}) {
  return (
    <span className={cn('tabular-nums whitespace-nowrap', className)}>
      {minor === null || minor === undefined ? '—' : formatMoney(minor, currency)}
    </span>
  );
}

/** How money moved, in words a member recognises. */
export const paymentKindLabels: Record<PaymentKind, string> = {
  checkout: 'Online payment',
  cash: 'Cash',
  lab_funds: 'Lab funds',
  refund: 'Refund',
};
