import { useState, type FormEvent } from 'react';
import { CreditCard } from 'lucide-react';
import type { OrderDetail, OrderShare } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input, Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { formatAmount } from '../../../lib/format';
import { useChangeShare, useCheckout, useClaim, useWithdrawShare } from '../api';
import { money, PaymentStatusBadge } from '../labels';

function stepHint(line: OrderDetail['lines'][number]): string {
  const remains = `${formatAmount(line.unclaimedQuantity, line.packUnit)} unclaimed`;
  return line.splittable
    ? `${remains}; claim any part in steps of ${formatAmount(line.claimStep, line.packUnit)}.`
    : `${remains}; whole packs of ${formatAmount(line.packSize, line.packUnit)} only.`;
}

function MyShare({ order, share }: { order: OrderDetail; share: OrderShare }) {
  const line = order.lines.find((item) => item.id === share.lineId);
  const change = useChangeShare(order.id);
  const withdraw = useWithdrawShare(order.id);
  const checkout = useCheckout(order.id);
  const [editing, setEditing] = useState(false);
  const [quantity, setQuantity] = useState(String(share.quantity));
  const error = change.error ?? withdraw.error ?? checkout.error;

  function save(event: FormEvent) {
    event.preventDefault();
    change.mutate(
      { shareId: share.id, quantity: Number(quantity) },
      { onSuccess: () => setEditing(false) },
    );
  }

  return (
    <li data-testid={`my-share-${share.id}`} className="flex flex-col gap-2 py-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="text-sm">
          <span className="font-medium text-ink-900 tabular-nums">
            {formatAmount(share.quantity, share.unit)}
          </span>{' '}
          of {line?.chemical.name ?? 'a line'}
        </p>
        <p className="text-sm tabular-nums">
          <span className="font-semibold">{money(share.amountMinor, order.currency)}</span>{' '}
          <span className="text-xs text-ink-600">
            {share.amountFixed ? 'fixed' : 'estimate: it moves as others claim'}
          </span>
        </p>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <PaymentStatusBadge status={share.paymentStatus} />
        {share.mayPay && (
          <Button
            variant="primary"
            size="sm"
            busy={checkout.isPending}
            icon={<CreditCard aria-hidden="true" className="size-4" />}
            onClick={() => checkout.mutate(share.id)}
          >
            {share.paymentStatus === 'pending' ? 'Finish paying' : 'Pay'}{' '}
            {money(share.amountMinor, order.currency)}
          </Button>
        )}
        {share.mayEdit && !editing && (
          <>
            <Button size="sm" onClick={() => setEditing(true)}>
              Change
            </Button>
            <Button
              size="sm"
              variant="ghost"
              busy={withdraw.isPending}
              onClick={() => withdraw.mutate(share.id)}
            >
              Withdraw
            </Button>
          </>
        )}
      </div>
      {editing && line && (
        <form onSubmit={save} className="flex flex-wrap items-end gap-2">
          <Field label={`New quantity (${line.packUnit})`} hint={stepHint(line)} className="w-64">
            {(control) => (
              <Input
                {...control}
                type="number"
                inputMode="decimal"
                min={line.claimStep}
                step={line.claimStep}
                value={quantity}
                onChange={(e) => setQuantity(e.target.value)}
              />
            )}
          </Field>
          <Button type="submit" variant="primary" size="sm" busy={change.isPending}>
            Save
          </Button>
          <Button size="sm" variant="ghost" onClick={() => setEditing(false)}>
            Keep as it was
          </Button>
        </form>
      )}
      {error && <Notice tone="danger">{errorMessage(error)}</Notice>}
    </li>
  );
}

function ClaimForm({ order }: { order: OrderDetail }) {
  const claim = useClaim(order.id);
  const open = order.lines.filter((line) => line.unclaimedQuantity > 0);
  const [lineId, setLineId] = useState<number | null>(open[0]?.id ?? null);
  const [quantity, setQuantity] = useState('');
  const line = order.lines.find((item) => item.id === lineId) ?? open[0];
  if (open.length === 0 || !line) {
    return <p className="text-sm text-ink-600">Everything on this order is claimed.</p>;
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    if (!line) return;
    claim.mutate(
      { lineId: line.id, quantity: Number(quantity) },
      { onSuccess: () => setQuantity('') },
    );
  }

  return (
    <form
      onSubmit={submit}
      className="flex flex-col gap-3 border-t border-ink-100 pt-3"
      aria-label="Claim a share"
    >
      <h3 className="text-sm font-semibold text-ink-900">Claim a share</h3>
      <div className="flex flex-wrap items-start gap-3">
        <Field label="Chemical" className="min-w-56 flex-1">
          {(control) => (
            <Select
              {...control}
              value={line.id}
              onChange={(e) => setLineId(Number(e.target.value))}
            >
              {open.map((item) => (
                <option key={item.id} value={item.id}>
                  {item.chemical.name} — {item.packs} × {formatAmount(item.packSize, item.packUnit)}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field label={`Quantity (${line.packUnit})`} hint={stepHint(line)} className="w-64">
          {(control) => (
            <Input
              {...control}
              type="number"
              inputMode="decimal"
              required
              min={line.claimStep}
              max={line.unclaimedQuantity}
              step={line.claimStep}
              value={quantity}
              onChange={(e) => setQuantity(e.target.value)}
            />
          )}
        </Field>
      </div>
      <div>
        <Button type="submit" variant="primary" busy={claim.isPending}>
          Claim
        </Button>
      </div>
      {claim.isError && <Notice tone="danger">{errorMessage(claim.error)}</Notice>}
    </form>
  );
}

/** The reader's own shares: claim, change, withdraw while claims are open; pay once fixed. */
export function YourSharePanel({ order }: { order: OrderDetail }) {
  const mine = order.shares.filter((share) => share.mine);
  if (!order.abilities.mayClaim && mine.length === 0) return null;
  return (
    <section
      aria-labelledby="your-share-heading"
      className="flex flex-col gap-2 rounded-lg border border-accent-200 bg-white px-4 py-3"
    >
      <h2 id="your-share-heading" className="text-base font-semibold text-ink-900">
        Your share
      </h2>
      {mine.length > 0 ? (
        <>
          <ul className="divide-y divide-ink-100">
            {mine.map((share) => (
              <MyShare key={share.id} order={order} share={share} />
            ))}
          </ul>
          <p className="text-sm text-ink-700 tabular-nums" data-testid="my-total">
            Your total: <strong>{money(order.mine.amountMinor, order.currency)}</strong>
            {order.mine.amountFixed
              ? ` · still to pay ${money(order.mine.owedMinor, order.currency)}`
              : ' (an estimate until claims close)'}
          </p>
        </>
      ) : (
        <p className="text-sm text-ink-600">You have not claimed anything on this order.</p>
      )}
      {order.abilities.mayClaim && <ClaimForm order={order} />}
    </section>
  );
}
