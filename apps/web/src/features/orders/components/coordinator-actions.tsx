import { useState } from 'react';
import { Ban, FileText, Lock, Megaphone, PackagePlus, Truck } from 'lucide-react';
import { decimalTextToMinor, type OrderDetail } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog, Dialog } from '../../../components/ui/dialog';
import { Field } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { useCancelOrder, useMarkOrdered, useOrderStep, useRecordInvoice } from '../api';
import { money } from '../labels';

type Open = 'close' | 'ordered' | 'invoice' | 'cancel' | null;

function AmountField({
  label,
  value,
  onChange,
  currency,
  error,
  optional,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  currency: string;
  error?: string;
  optional?: boolean;
}) {
  return (
    <Field
      label={`${label} (${currency})`}
      error={error}
      optional={optional}
      hint="e.g. 97.35"
      className="w-48"
    >
      {(control) => (
        <AmountInput {...control} value={value} onChange={(e) => onChange(e.target.value)} />
      )}
    </Field>
  );
}

/** The coordinator's moves on the order, each shown only when the server says it may be made. */
export function CoordinatorActions({ order }: { order: OrderDetail }) {
  const step = useOrderStep(order.id);
  const markOrdered = useMarkOrdered(order.id);
  const invoice = useRecordInvoice(order.id);
  const cancel = useCancelOrder(order.id);
  const [open, setOpen] = useState<Open>(null);
  const [reason, setReason] = useState('');
  const [reference, setReference] = useState('');
  const [amount, setAmount] = useState('');
  const [amountError, setAmountError] = useState<string | undefined>();
  const a = order.abilities;
  if (!a.mayManage) return null;
  const any =
    a.mayOpen ||
    a.mayTakeRemainder ||
    a.mayCloseClaims ||
    a.mayMarkOrdered ||
    a.mayRecordInvoice ||
    a.mayCancel;
  if (!any) return null;

  function parsedAmount(required: boolean): number | null | undefined {
    if (!amount.trim()) {
      if (required) setAmountError('give the amount');
      return required ? undefined : null;
    }
    const minor = decimalTextToMinor(amount, order.currency);
    if (minor === null) {
      setAmountError(`write it as a plain amount in ${order.currency}, e.g. 97.35`);
      return undefined;
    }
    setAmountError(undefined);
    return minor;
  }

  const close = () => {
    setOpen(null);
    step.reset();
    markOrdered.reset();
    invoice.reset();
    cancel.reset();
  };

  return (
    <section aria-label="Coordinator" className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        {a.mayOpen && (
          <Button
            variant="primary"
            busy={step.isPending && step.variables === 'open'}
            icon={<Megaphone aria-hidden="true" className="size-4" />}
            onClick={() => step.mutate('open')}
          >
            Open for claims
          </Button>
        )}
        {a.mayTakeRemainder && (
          <Button
            busy={step.isPending && step.variables === 'lab-remainder'}
            icon={<PackagePlus aria-hidden="true" className="size-4" />}
            onClick={() => step.mutate('lab-remainder')}
          >
            Take the rest for the lab
          </Button>
        )}
        {a.mayCloseClaims && (
          <Button
            variant="primary"
            icon={<Lock aria-hidden="true" className="size-4" />}
            onClick={() => setOpen('close')}
          >
            Close claims
          </Button>
        )}
        {a.mayMarkOrdered && (
          <Button
            variant="primary"
            icon={<Truck aria-hidden="true" className="size-4" />}
            onClick={() => setOpen('ordered')}
          >
            Mark ordered
          </Button>
        )}
        {a.mayRecordInvoice && (
          <Button
            icon={<FileText aria-hidden="true" className="size-4" />}
            onClick={() => setOpen('invoice')}
          >
            Record supplier invoice
          </Button>
        )}
        {a.mayCancel && (
          <Button
            variant="ghost"
            icon={<Ban aria-hidden="true" className="size-4" />}
            onClick={() => setOpen('cancel')}
          >
            Cancel order
          </Button>
        )}
      </div>
      {step.isError && open === null && <Notice tone="danger">{errorMessage(step.error)}</Notice>}

      <ConfirmDialog
        open={open === 'close'}
        title="Close claims?"
        confirmLabel="Close claims and fix amounts"
        busy={step.isPending}
        onCancel={close}
        onConfirm={() => step.mutate('close-claims', { onSuccess: () => setOpen(null) })}
        error={step.isError && <Notice tone="danger">{errorMessage(step.error)}</Notice>}
      >
        <p>
          Every share’s amount is then fixed at what it is now, adding up to{' '}
          <strong className="tabular-nums">{money(order.totalMinor, order.currency)}</strong>.
          Members can no longer change their claims and are e-mailed what to pay.
        </p>
      </ConfirmDialog>

      <ConfirmDialog
        open={open === 'cancel'}
        title="Cancel this order?"
        confirmLabel="Cancel the order"
        busy={cancel.isPending}
        onCancel={close}
        onConfirm={() => cancel.mutate(reason, { onSuccess: () => setOpen(null) })}
        error={cancel.isError && <Notice tone="danger">{errorMessage(cancel.error)}</Notice>}
      >
        <p>
          Members with a share are told by e-mail.
          {order.collectedMinor > order.refundedMinor
            ? ' Everything paid for it is refunded through the payment provider.'
            : ' Nothing has been paid for it.'}{' '}
          This cannot be undone.
        </p>
        <Field label="Reason" hint="Members read it in the e-mail.">
          {(control) => (
            <Textarea
              {...control}
              rows={2}
              value={reason}
              onChange={(e) => setReason(e.target.value)}
            />
          )}
        </Field>
      </ConfirmDialog>

      <Dialog
        open={open === 'ordered'}
        onClose={close}
        size="sm"
        title="Mark ordered"
        description="Every share is paid; record that the order went to the supplier."
        footer={
          <>
            <Button onClick={close}>Go back</Button>
            <Button
              variant="primary"
              busy={markOrdered.isPending}
              onClick={() => {
                const minor = parsedAmount(false);
                if (minor === undefined) return;
                markOrdered.mutate(
                  { supplierReference: reference, supplierInvoiceMinor: minor },
                  { onSuccess: () => setOpen(null) },
                );
              }}
            >
              Mark ordered
            </Button>
          </>
        }
      >
        <div className="flex flex-col gap-3">
          <Field label="Supplier’s order number or reference">
            {(control) => (
              <Input
                {...control}
                value={reference}
                onChange={(e) => setReference(e.target.value)}
              />
            )}
          </Field>
          <AmountField
            label="Supplier’s invoice total"
            optional
            value={amount}
            onChange={setAmount}
            currency={order.currency}
            error={amountError}
          />
          {markOrdered.isError && <Notice tone="danger">{errorMessage(markOrdered.error)}</Notice>}
        </div>
      </Dialog>

      <Dialog
        open={open === 'invoice'}
        onClose={close}
        size="sm"
        title="Record supplier invoice"
        description={`The shares add up to ${money(order.totalMinor, order.currency)}; the invoice is kept beside it for the books.`}
        footer={
          <>
            <Button onClick={close}>Go back</Button>
            <Button
              variant="primary"
              busy={invoice.isPending}
              onClick={() => {
                const minor = parsedAmount(true);
                if (minor === undefined || minor === null) return;
                invoice.mutate(minor, { onSuccess: () => setOpen(null) });
              }}
            >
              Save
            </Button>
          </>
        }
      >
        <div className="flex flex-col gap-3">
          <AmountField
            label="Invoice total"
            value={amount}
            onChange={setAmount}
            currency={order.currency}
            error={amountError}
          />
          {invoice.isError && <Notice tone="danger">{errorMessage(invoice.error)}</Notice>}
        </div>
      </Dialog>
    </section>
  );
}
