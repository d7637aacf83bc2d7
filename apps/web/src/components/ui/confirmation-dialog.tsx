import { useCallback, useState } from 'react';
import { Archive, Flame, Ruler, ShieldAlert } from 'lucide-react';
import {
  containerMaterialLabels,
  roomRulesReminder,
  safetyDeferral,
  type ConfirmationWarning,
  type ContainerMaterial,
} from '@lotwise/shared';
import type { AskConfirmation } from '../../lib/api-client';
import { formatAmount, formatDate, formatLitres } from '../../lib/format';
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

function FlammableLimitItem({
  warning,
}: {
  warning: Extract<ConfirmationWarning, { kind: 'flammable_limit' }>;
}) {
  const over = warning.afterLitres - warning.limitLitres;
  return (
    <li className="flex gap-2">
      <Flame aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-danger-700" />
      <div>
        <p className="font-semibold">
          {warning.labAreaName} · {warning.limit}
        </p>
        <p className="tabular-nums">
          Holds {formatLitres(warning.heldLitres)} now, {formatLitres(warning.afterLitres)} after
          this, against a limit of {formatLitres(warning.limitLitres)}:{' '}
          <strong>{formatLitres(over)} over</strong>.
        </p>
        <p className="text-xs text-ink-600">Limit from {warning.source}</p>
      </div>
    </li>
  );
}

function ContainerSizeItem({
  warning,
}: {
  warning: Extract<ConfirmationWarning, { kind: 'container_size' }>;
}) {
  return (
    <li className="flex gap-2">
      <Ruler aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-danger-700" />
      <div>
        <p>{warning.message}</p>
        <p className="tabular-nums">
          Class {warning.liquidClass} in{' '}
          {(
            containerMaterialLabels[warning.material as ContainerMaterial] ?? warning.material
          ).toLowerCase()}
          : the container holds {formatLitres(warning.capacityLitres)}; the largest allowed is{' '}
          <strong>{formatLitres(warning.limitLitres)}</strong>.
        </p>
        <p className="text-xs text-ink-600">Limit from {warning.source}</p>
      </div>
    </li>
  );
}

function dialogTitle(warnings: ConfirmationWarning[]): string {
  const kinds = new Set(warnings.map((w) => w.kind));
  if (kinds.size === 1 && kinds.has('hold')) return 'This takes stock held for a plan';
  if (kinds.size === 1 && kinds.has('storage_conflict')) return 'Check the storage before saving';
  if (kinds.size === 1 && kinds.has('flammable_limit'))
    return 'This goes over a flammable-liquid limit';
  if (kinds.size === 1 && kinds.has('container_size'))
    return 'This container is larger than allowed';
  if (!kinds.has('hold')) return 'Check the room rules before saving';
  return 'Confirm before saving';
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
  const limits = warnings.filter((w) => w.kind === 'flammable_limit');
  const sizes = warnings.filter((w) => w.kind === 'container_size');
  const onlyHolds = holds.length > 0 && holds.length === warnings.length;
  const title = dialogTitle(warnings);
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
            {onlyHolds ? 'Draw anyway' : 'Save anyway'}
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
        {(limits.length > 0 || sizes.length > 0) && (
          <section aria-label="Room rules" className="flex flex-col gap-2">
            <ul className="flex flex-col gap-2">
              {limits.map((warning, index) => (
                <FlammableLimitItem key={`limit-${index}`} warning={warning} />
              ))}
              {sizes.map((warning, index) => (
                <ContainerSizeItem key={`size-${index}`} warning={warning} />
              ))}
            </ul>
            <p className="text-xs text-ink-600">{roomRulesReminder}</p>
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
