import { useCallback, useState } from 'react';
import { Archive, ShieldAlert } from 'lucide-react';
import { safetyDeferral, type ConfirmationWarning } from '@lotwise/shared';
import type { AskConfirmation } from '../../lib/api-client';
import { formatAmount, formatDate } from '../../lib/format';
import { Button } from './button';
import { Dialog } from './dialog';

function HoldItem({ warning }: { warning: Extract<ConfirmationWarning, { kind: 'hold' }> }) {
  return (
    <li className="flex gap-2">
      <Archive aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-warn-700" />
      <div>
        <p className="font-semibold">
          Plan #{warning.planId} · {warning.planTitle} · planned for {formatDate(warning.plannedOn)}
        </p>
        <p className="tabular-nums">
          {warning.labelCode}: holds {formatAmount(warning.heldBefore, warning.unit)} for it; this
          leaves {formatAmount(warning.heldAfter, warning.unit)}. The plan loses{' '}
          <strong>{formatAmount(warning.loses, warning.unit)}</strong>.
        </p>
      </div>
    </li>
  );
}

function StorageItem({
  warning,
}: {
  warning: Extract<ConfirmationWarning, { kind: 'storage_conflict' }>;
}) {
  return (
    <li className="flex gap-2">
      <ShieldAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-danger-700" />
      <div>
        <p>{warning.message}</p>
        {warning.source && <p className="text-xs text-ink-600">Source: {warning.source}</p>}
      </div>
    </li>
  );
}

/**
 * What a write needs confirmed (the warnings of a 409 `confirmation_required`), with a way
 * back that saves nothing and a way on that sends the write again with `confirm: true`.
 */
export function ConfirmationDialog({
  open,
  warnings,
  onConfirm,
  onCancel,
}: {
  open: boolean;
  warnings: ConfirmationWarning[];
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const holds = warnings.filter((w) => w.kind === 'hold');
  const storage = warnings.filter((w) => w.kind === 'storage_conflict');
  const title =
    holds.length > 0 && storage.length === 0
      ? 'This takes stock held for a plan'
      : holds.length === 0
        ? 'Check the storage before saving'
        : 'Confirm before saving';
  return (
    <Dialog
      open={open}
      onClose={onCancel}
      title={title}
      description="Nothing has been saved yet."
      footer={
        <>
          <Button onClick={onCancel}>Go back</Button>
          <Button variant="danger" onClick={onConfirm}>
            {holds.length > 0 && storage.length === 0 ? 'Draw anyway' : 'Save anyway'}
          </Button>
        </>
      }
    >
      <div className="flex flex-col gap-3 text-sm text-ink-800">
        {holds.length > 0 && (
          <section aria-label="Held for plans" className="flex flex-col gap-2">
            <p>
              Less than is held would be left for {holds.length === 1 ? 'this plan' : 'these plans'}
              . Tell the person who planned it, or choose another container.
            </p>
            <ul className="flex flex-col gap-2">
              {holds.map((warning) => (
                <HoldItem key={`${warning.planId}-${warning.containerId}`} warning={warning} />
              ))}
            </ul>
          </section>
        )}
        {storage.length > 0 && (
          <section aria-label="Storage rules" className="flex flex-col gap-2">
            <ul className="flex flex-col gap-2">
              {storage.map((warning, index) => (
                <StorageItem key={index} warning={warning} />
              ))}
            </ul>
            <p className="text-xs text-ink-600">{safetyDeferral}</p>
          </section>
        )}
      </div>
    </Dialog>
  );
}

interface Pending {
  warnings: ConfirmationWarning[];
  resolve: (answer: boolean) => void;
}

/**
 * `ask` for {@link sendWithConfirmation}, and the dialog that asks: render `dialog` once in
 * the component that sends.
 */
export function useConfirmation(): { ask: AskConfirmation; dialog: React.ReactNode } {
  const [pending, setPending] = useState<Pending | null>(null);
  const ask = useCallback<AskConfirmation>(
    (warnings) => new Promise<boolean>((resolve) => setPending({ warnings, resolve })),
    [],
  );
  const answer = (value: boolean) => {
    pending?.resolve(value);
    setPending(null);
  };
  const dialog = (
    <ConfirmationDialog
      open={pending !== null}
      warnings={pending?.warnings ?? []}
      onConfirm={() => answer(true)}
      onCancel={() => answer(false)}
    />
  );
  return { ask, dialog };
}
