import { useState, type FormEvent, type ReactNode } from 'react';
import { Link } from 'react-router';
import { ArrowRightLeft, ClipboardCheck, Scissors, Trash2 } from 'lucide-react';
import {
  adjustmentSchema,
  splitSchema,
  transferSchema,
  type ContainerChange,
  type ContainerDetail,
} from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { useConfirmation } from '../../../components/ui/confirmation-dialog';
import { ConfirmDialog, Dialog } from '../../../components/ui/dialog';
import { Field, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage, isApiError, sendWithConfirmation } from '../../../lib/api-client';
import { formatAmount } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';
import { paths } from '../../../config/paths';
import {
  useAdjustContainer,
  useDisposeContainer,
  useSplitContainer,
  useTransferContainer,
} from '../api';
import { drawUnits } from '../weighing';
import { LocationSelect } from './location-select';
import { SegregationWarnings } from './segregation-warnings';

type Action = 'adjust' | 'split' | 'transfer' | 'dispose';
type Errors = Record<string, string | undefined>;

/** Field messages from a zod result or an API error, keyed by the form's own field names. */
function issuesOf(issues: { path: PropertyKey[]; message: string }[]): Errors {
  const errors: Errors = {};
  for (const issue of issues) errors[String(issue.path[0] ?? 'form')] ??= issue.message;
  return errors;
}

function serverErrors(error: unknown): { errors: Errors; message: string } {
  if (!isApiError(error)) return { errors: {}, message: errorMessage(error) };
  return { errors: error.fields, message: error.message };
}

/**
 * Sends a write that may break a storage rule: the server's warnings are shown in the
 * confirmation dialog first, and the write is sent again with `confirm: true` if the person
 * goes ahead. Going back saves nothing and clears the error.
 */
function useConfirmedWrite<TBody extends object>(mutation: {
  mutateAsync: (body: TBody & { confirm?: boolean }) => Promise<ContainerChange>;
  reset: () => void;
}) {
  const confirmation = useConfirmation();
  function send(
    body: TBody,
    onSaved: (change: ContainerChange) => void,
    onErrors: (errors: Errors) => void,
  ) {
    sendWithConfirmation(
      (confirm) => mutation.mutateAsync(confirm ? { ...body, confirm } : body),
      confirmation.ask,
    ).then(
      (change) => (change ? onSaved(change) : mutation.reset()),
      (error: unknown) => onErrors(serverErrors(error).errors),
    );
  }
  return { send, dialog: confirmation.dialog };
}

function number(text: string): number | undefined {
  const value = parseDecimal(text);
  return value === null ? undefined : value;
}

function ActionDialog({
  open,
  title,
  description,
  onClose,
  onSubmit,
  submitLabel,
  busy,
  done,
  children,
}: {
  open: boolean;
  title: string;
  description?: ReactNode;
  onClose: () => void;
  onSubmit: () => void;
  submitLabel: string;
  busy: boolean;
  done: boolean;
  children: ReactNode;
}) {
  const formId = `${title.replace(/\W+/g, '-').toLowerCase()}-form`;
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title={title}
      description={description}
      footer={
        done ? (
          <Button variant="primary" onClick={onClose}>
            Done
          </Button>
        ) : (
          <>
            <Button onClick={onClose} disabled={busy}>
              Cancel
            </Button>
            <Button variant="primary" type="submit" form={formId} busy={busy}>
              {submitLabel}
            </Button>
          </>
        )
      }
    >
      <form
        id={formId}
        noValidate
        className="flex flex-col gap-4"
        onSubmit={(event: FormEvent) => {
          event.preventDefault();
          onSubmit();
        }}
      >
        {children}
      </form>
    </Dialog>
  );
}

function AdjustDialog({ container, onClose }: { container: ContainerDetail; onClose: () => void }) {
  const adjust = useAdjustContainer(container.id);
  const [counted, setCounted] = useState('');
  const [unit, setUnit] = useState<string>(container.unit);
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [result, setResult] = useState<ContainerChange | null>(null);

  function handleSubmit() {
    const body = { countedQuantity: number(counted), unit, note: note.trim() };
    const checked = adjustmentSchema.safeParse(body);
    if (!checked.success) return setErrors(issuesOf(checked.error.issues));
    setErrors({});
    adjust.mutate(body, {
      onSuccess: setResult,
      onError: (error) => setErrors(serverErrors(error).errors),
    });
  }

  return (
    <ActionDialog
      open
      title={`Adjust ${container.labelCode}`}
      description={`Recorded balance: ${formatAmount(container.quantity, container.unit)}. Enter what is really there; the difference is written to the ledger as an adjustment.`}
      onClose={onClose}
      onSubmit={handleSubmit}
      submitLabel="Save adjustment"
      busy={adjust.isPending}
      done={result !== null}
    >
      {result ? (
        <Notice tone="ok" title="Adjusted">
          Balance now {formatAmount(result.container.quantity, result.container.unit)}.
        </Notice>
      ) : (
        <>
          {adjust.isError && (
            <Notice tone="danger" title="Not saved">
              {errorMessage(adjust.error)}
            </Notice>
          )}
          <AmountWithUnit
            label="Counted amount"
            error={fieldMessage('Counted amount', errors.countedQuantity)}
            unitError={fieldMessage('Unit', errors.unit)}
            value={counted}
            onValueChange={setCounted}
            unit={unit}
            onUnitChange={setUnit}
            units={drawUnits(container.chemical)}
          />
          <Field
            label="Reason"
            error={fieldMessage('Reason', errors.note)}
            hint="e.g. spilled while weighing, recounted at stocktake"
          >
            {(c) => <Input {...c} value={note} onChange={(e) => setNote(e.target.value)} />}
          </Field>
        </>
      )}
    </ActionDialog>
  );
}

function SplitDialog({ container, onClose }: { container: ContainerDetail; onClose: () => void }) {
  const split = useSplitContainer(container.id);
  const write = useConfirmedWrite(split);
  const [quantity, setQuantity] = useState('');
  const [unit, setUnit] = useState<string>(container.unit);
  const [locationId, setLocationId] = useState<number | undefined>(container.location.id);
  const [tare, setTare] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [result, setResult] = useState<ContainerChange | null>(null);

  function handleSubmit() {
    const tareMass = number(tare);
    const body = {
      quantity: number(quantity) as number,
      unit,
      locationId: locationId as number,
      tareMass: tareMass ?? null,
      note: note.trim(),
    };
    const checked = splitSchema.safeParse(body);
    if (!checked.success) return setErrors(issuesOf(checked.error.issues));
    setErrors({});
    write.send(body, setResult, setErrors);
  }

  return (
    <>
      <ActionDialog
        open
        title={`Split ${container.labelCode}`}
        description="Pour part of this container into a new labelled one, e.g. a working bottle. Both sides are written to the ledger."
        onClose={onClose}
        onSubmit={handleSubmit}
        submitLabel="Split into new container"
        busy={split.isPending}
        done={result !== null}
      >
        {result?.newContainer ? (
          <div className="flex flex-col gap-3">
            <Notice tone="ok" title={`New container ${result.newContainer.labelCode}`}>
              It holds {formatAmount(result.newContainer.quantity, result.newContainer.unit)} at{' '}
              {result.newContainer.location.path}. Label it with{' '}
              <strong className="font-mono">{result.newContainer.labelCode}</strong>.{' '}
              <Link
                to={paths.stockContainer(result.newContainer.id)}
                className="text-accent-700 underline underline-offset-2"
                onClick={onClose}
              >
                Open it
              </Link>
            </Notice>
            <SegregationWarnings warnings={result.warnings} />
          </div>
        ) : (
          <>
            {split.isError && (
              <Notice tone="danger" title="Not split">
                {errorMessage(split.error)}
              </Notice>
            )}
            <AmountWithUnit
              label="Amount to pour off"
              error={fieldMessage('Amount', errors.quantity)}
              hint={`At most ${formatAmount(container.quantity, container.unit)}`}
              unitError={fieldMessage('Unit', errors.unit)}
              value={quantity}
              onValueChange={setQuantity}
              unit={unit}
              onUnitChange={setUnit}
              units={drawUnits(container.chemical)}
            />
            <Field
              label="Where the new container goes"
              error={fieldMessage('Location', errors.locationId)}
            >
              {(c) => <LocationSelect {...c} value={locationId} onChange={setLocationId} />}
            </Field>
            <Field
              label="Tare of the new container (g)"
              optional
              error={fieldMessage('Tare', errors.tareMass)}
              hint="Empty with cap; lets people record draws by weighing."
            >
              {(c) => <AmountInput {...c} value={tare} onChange={(e) => setTare(e.target.value)} />}
            </Field>
            <Field label="Note" optional error={fieldMessage('Note', errors.note)}>
              {(c) => <Input {...c} value={note} onChange={(e) => setNote(e.target.value)} />}
            </Field>
          </>
        )}
      </ActionDialog>
      {write.dialog}
    </>
  );
}

function TransferDialog({
  container,
  onClose,
}: {
  container: ContainerDetail;
  onClose: () => void;
}) {
  const transfer = useTransferContainer(container.id);
  const write = useConfirmedWrite(transfer);
  const [locationId, setLocationId] = useState<number | undefined>();
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [result, setResult] = useState<ContainerChange | null>(null);

  function handleSubmit() {
    const body = { locationId: locationId as number, note: note.trim() };
    const checked = transferSchema.safeParse(body);
    if (!checked.success) return setErrors(issuesOf(checked.error.issues));
    setErrors({});
    write.send(body, setResult, setErrors);
  }

  return (
    <>
      <ActionDialog
        open
        title={`Move ${container.labelCode}`}
        description={`Now at ${container.location.path}.`}
        onClose={onClose}
        onSubmit={handleSubmit}
        submitLabel="Move container"
        busy={transfer.isPending}
        done={result !== null}
      >
        {result ? (
          <div className="flex flex-col gap-3">
            <Notice tone="ok" title="Moved">
              {result.container.labelCode} is now at {result.container.location.path}.
            </Notice>
            {result.warnings.length > 0 ? (
              <SegregationWarnings warnings={result.warnings} title="Check the storage there" />
            ) : (
              <p className="text-sm text-ink-700">
                Lotwise found no storage rule broken at the new place. That is not a safety
                approval: the SDS and your local rules decide.
              </p>
            )}
          </div>
        ) : (
          <>
            {transfer.isError && (
              <Notice tone="danger" title="Not moved">
                {errorMessage(transfer.error)}
              </Notice>
            )}
            <Field label="Move to" error={fieldMessage('Location', errors.locationId)}>
              {(c) => (
                <LocationSelect
                  {...c}
                  value={locationId}
                  onChange={setLocationId}
                  exclude={new Set([container.location.id])}
                />
              )}
            </Field>
            <Field label="Note" optional error={fieldMessage('Note', errors.note)}>
              {(c) => <Input {...c} value={note} onChange={(e) => setNote(e.target.value)} />}
            </Field>
          </>
        )}
      </ActionDialog>
      {write.dialog}
    </>
  );
}

function DisposeDialog({
  container,
  onClose,
}: {
  container: ContainerDetail;
  onClose: () => void;
}) {
  const dispose = useDisposeContainer(container.id);
  const [note, setNote] = useState('');
  return (
    <ConfirmDialog
      open
      title={`Dispose of ${container.labelCode}?`}
      confirmLabel="Dispose of container"
      busy={dispose.isPending}
      onConfirm={() => dispose.mutate({ note: note.trim() }, { onSuccess: () => onClose() })}
      onCancel={onClose}
      error={
        dispose.isError && (
          <Notice tone="danger" title="Not disposed">
            {errorMessage(dispose.error)}
          </Notice>
        )
      }
    >
      <p>
        What is left ({formatAmount(container.quantity, container.unit)} of{' '}
        {container.chemical.name}) is written off and the container is marked disposed. The ledger
        keeps its history. Follow the SDS and your local rules for the waste itself.
      </p>
      <Field label="Note" optional>
        {(c) => <Input {...c} value={note} onChange={(e) => setNote(e.target.value)} />}
      </Field>
    </ConfirmDialog>
  );
}

/** Adjust, split, move and dispose: for roles with `stock.write`. */
export function ContainerActions({ container }: { container: ContainerDetail }) {
  const [open, setOpen] = useState<Action | null>(null);
  const close = () => setOpen(null);
  const disposed = container.status === 'disposed';
  const empty = container.quantity <= 0;
  return (
    <>
      <div className="flex flex-wrap gap-2">
        <Button
          disabled={disposed}
          onClick={() => setOpen('adjust')}
          icon={<ClipboardCheck aria-hidden="true" className="size-4" />}
        >
          Adjust
        </Button>
        <Button
          disabled={disposed || empty}
          onClick={() => setOpen('split')}
          icon={<Scissors aria-hidden="true" className="size-4" />}
        >
          Split
        </Button>
        <Button
          disabled={disposed}
          onClick={() => setOpen('transfer')}
          icon={<ArrowRightLeft aria-hidden="true" className="size-4" />}
        >
          Move
        </Button>
        <Button
          disabled={disposed}
          onClick={() => setOpen('dispose')}
          icon={<Trash2 aria-hidden="true" className="size-4" />}
        >
          Dispose
        </Button>
      </div>
      {open === 'adjust' && <AdjustDialog container={container} onClose={close} />}
      {open === 'split' && <SplitDialog container={container} onClose={close} />}
      {open === 'transfer' && <TransferDialog container={container} onClose={close} />}
      {open === 'dispose' && <DisposeDialog container={container} onClose={close} />}
    </>
  );
}

/** An amount typed as a decimal, with the unit it is in beside it. */
function AmountWithUnit({
  label,
  error,
  hint,
  unitError,
  value,
  onValueChange,
  unit,
  onUnitChange,
  units,
}: {
  label: string;
  error: string | undefined;
  hint?: string;
  unitError: string | undefined;
  value: string;
  onValueChange: (value: string) => void;
  unit: string;
  onUnitChange: (unit: string) => void;
  units: readonly string[];
}) {
  return (
    <div className="grid gap-3 sm:grid-cols-[1fr_7rem]">
      <Field label={label} error={error} hint={hint}>
        {(c) => (
          <AmountInput {...c} value={value} onChange={(e) => onValueChange(e.target.value)} />
        )}
      </Field>
      <Field label="Unit" error={unitError}>
        {(c) => (
          <Select {...c} value={unit} onChange={(e) => onUnitChange(e.target.value)}>
            {units.map((u) => (
              <option key={u}>{u}</option>
            ))}
          </Select>
        )}
      </Field>
    </div>
  );
}
