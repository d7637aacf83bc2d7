import { useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { useFieldArray, useForm, useWatch, type FieldPath } from 'react-hook-form';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ChevronLeft, Copy, PackagePlus, Plus, Printer, Trash2 } from 'lucide-react';
import {
  containerMaterialLabels,
  containerMaterials,
  countOf,
  chemicalSchema,
  containerCreateSchema,
  lotCreateSchema,
  todayIso,
  type Chemical,
  type ContainerChange,
  type ContainerCreate,
  type ContainerMaterial,
  type Lot,
  type LotCreate,
} from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button, buttonClasses } from '../../../components/ui/button';
import { useConfirmation } from '../../../components/ui/confirmation-dialog';
import { Field, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import {
  api,
  errorMessage,
  isApiError,
  sendWithConfirmation,
  withQuery,
} from '../../../lib/api-client';
import { formatAmount, formatDate, formatPercent } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';
import { paths } from '../../../config/paths';
import { createContainer, createLot, deleteLot, stockKeys, useChemicalLots } from '../api';
import { ChemicalPicker } from '../components/chemical-picker';
import { LocationSelect } from '../components/location-select';
import { SegregationWarnings } from '../components/segregation-warnings';
import { drawUnits } from '../weighing';
import { TableScroll } from '../../../components/ui/table-scroll';

interface ContainerRow {
  quantity: string;
  unit: string;
  tareMass: string;
  capacity: string;
  capacityUnit: string;
  /** '' or a container material (for the container-size limits). */
  material: string;
  locationId: string;
  openedOn: string;
}

interface ReceiveValues {
  lotMode: 'new' | 'existing';
  lotId: string;
  supplierName: string;
  supplierLotNumber: string;
  grade: string;
  purityPercent: string;
  receivedOn: string;
  expiresOn: string;
  /** Why the delivery came in: on every container's ledger entry (required when watched). */
  note: string;
  containers: ContainerRow[];
}

const emptyRow = (unit: string): ContainerRow => ({
  quantity: '',
  unit,
  tareMass: '',
  capacity: '',
  capacityUnit: '',
  material: '',
  locationId: '',
  openedOn: '',
});

const lotLabels: Record<string, string> = {
  supplierName: 'Supplier',
  supplierLotNumber: 'Supplier lot number',
  grade: 'Grade',
  purityPercent: 'Purity',
  receivedOn: 'Received on',
  expiresOn: 'Expires on',
};
const containerLabels: Record<string, string> = {
  quantity: 'Quantity',
  unit: 'Unit',
  tareMass: 'Tare',
  capacity: 'Capacity',
  capacityUnit: 'Capacity unit',
  material: 'Material',
  locationId: 'Location',
  openedOn: 'Opened on',
};

/** A typed number for the API: empty -> null, not a number -> NaN (the schema says so). */
const decimal = (text: string) => parseDecimal(text);
const orNull = (text: string) => (text.trim() === '' ? null : text.trim());

function lotBody(chemicalId: number, v: ReceiveValues): LotCreate {
  return {
    chemicalId,
    source: 'purchased',
    supplierName: orNull(v.supplierName),
    supplierLotNumber: orNull(v.supplierLotNumber),
    grade: orNull(v.grade),
    purityPercent: decimal(v.purityPercent),
    receivedOn: v.receivedOn,
    expiresOn: orNull(v.expiresOn),
  };
}

function containerBody(lotId: number, row: ContainerRow, note = ''): ContainerCreate {
  const capacity = decimal(row.capacity);
  return {
    ...(note.trim() ? { note: note.trim() } : {}),
    lotId,
    locationId: Number(row.locationId) || 0,
    quantity: decimal(row.quantity) ?? Number.NaN,
    unit: row.unit,
    tareMass: decimal(row.tareMass),
    capacity,
    capacityUnit: capacity === null ? null : row.capacityUnit || row.unit,
    material: (row.material || null) as ContainerMaterial | null,
    status: row.openedOn ? 'open' : 'sealed',
    openedOn: orNull(row.openedOn),
  };
}

interface Received {
  lot: Lot;
  changes: ContainerChange[];
}

function ReceivedView({
  received,
  chemical,
  onMore,
}: {
  received: Received;
  chemical: Chemical;
  onMore: () => void;
}) {
  const ids = received.changes.map((change) => change.container.id);
  const warned = received.changes.filter((change) => change.warnings.length > 0);
  return (
    <div className="flex flex-col gap-4">
      <Notice
        tone="ok"
        title={`${received.changes.length} ${received.changes.length === 1 ? 'container' : 'containers'} of ${chemical.name} received`}
      >
        Into lot {received.lot.supplierLotNumber ?? `#${received.lot.id}`}, received{' '}
        {formatDate(received.lot.receivedOn)}. Put a label with its code on each container.
      </Notice>
      <TableScroll className="rounded-lg border border-ink-200 bg-white">
        <table className="w-full text-sm" aria-label="New containers">
          <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
            <tr>
              <th className="px-2.5 py-2">Label code</th>
              <th className="px-2.5 py-2 text-right">Quantity</th>
              <th className="px-2.5 py-2">Location</th>
              <th className="px-2.5 py-2">Status</th>
            </tr>
          </thead>
          <tbody>
            {received.changes.map(({ container }) => (
              <tr key={container.id} className="border-b border-ink-100 last:border-b-0">
                <td className="px-2.5 py-2">
                  <Link
                    to={paths.stockContainer(container.id)}
                    className="font-mono font-semibold text-accent-700 underline-offset-2 hover:underline"
                  >
                    {container.labelCode}
                  </Link>
                </td>
                <td className="px-2.5 py-2 text-right tabular-nums">
                  {formatAmount(container.quantity, container.unit)}
                </td>
                <td className="px-2.5 py-2">{container.location.path}</td>
                <td className="px-2.5 py-2 capitalize">{container.status}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroll>
      {warned.map((change) => (
        <SegregationWarnings
          key={change.container.id}
          warnings={change.warnings}
          title={`${change.container.labelCode}: check the storage at ${change.container.location.path}`}
        />
      ))}
      <div className="flex flex-wrap gap-2">
        <Link
          to={withQuery(paths.stockLabels, { ids: ids.join(',') })}
          className={buttonClasses('primary')}
        >
          <Printer aria-hidden="true" className="size-4" />
          Print labels
        </Link>
        <Button onClick={onMore} icon={<PackagePlus aria-hidden="true" className="size-4" />}>
          Receive more stock
        </Button>
        <Link to={paths.stockChemical(chemical.id)} className={buttonClasses('ghost')}>
          Stock of {chemical.name}
        </Link>
      </div>
    </div>
  );
}

/** `/stock/receive`: a delivery comes in: its chemical, its lot, its containers. */
export function ReceivePage() {
  const [searchParams] = useSearchParams();
  const preselected = Number(searchParams.get('chemicalId')) || undefined;
  const [chosen, setChosen] = useState<Chemical | null>(null);
  const initial = useQuery({
    queryKey: stockKeys.chemical(preselected ?? 0),
    enabled: preselected !== undefined && chosen === null,
    queryFn: ({ signal }) => api.get(`/api/chemicals/${preselected}`, chemicalSchema, signal),
  });
  const chemical = chosen ?? (preselected ? (initial.data ?? null) : null);
  const [chemicalError, setChemicalError] = useState<string | undefined>();
  const [received, setReceived] = useState<Received | null>(null);
  const [partial, setPartial] = useState<{ done: ContainerChange[]; message: string } | null>(null);
  const queryClient = useQueryClient();
  const confirmation = useConfirmation();
  const lots = useChemicalLots(chemical?.id);
  const defaultUnit = chemical?.stockUnit ?? 'g';

  const form = useForm<ReceiveValues>({
    defaultValues: {
      lotMode: 'new',
      lotId: '',
      supplierName: '',
      supplierLotNumber: '',
      grade: '',
      purityPercent: '',
      receivedOn: todayIso(),
      expiresOn: '',
      note: '',
      containers: [emptyRow(defaultUnit)],
    },
  });
  const { register, handleSubmit, setError, clearErrors, formState, getValues, setValue } = form;
  const rows = useFieldArray({ control: form.control, name: 'containers' });
  const lotMode = useWatch({ control: form.control, name: 'lotMode' });
  const rowValues = useWatch({ control: form.control, name: 'containers' });
  const units = chemical ? drawUnits(chemical) : ['g'];
  // A watched chemical is received with why: the field says so before submitting.
  const watchedBy = [...new Set((chemical?.watchListings ?? []).map((l) => l.listName))].join('; ');

  const receive = useMutation({
    mutationFn: async ({
      lot,
      bodies,
      note,
    }: {
      lot: LotCreate | Lot;
      bodies: ContainerRow[];
      note: string;
    }) => {
      const isNewLot = !('id' in lot);
      const saved = 'id' in lot ? lot : await createLot(lot);
      const done: ContainerChange[] = [];
      // A place confirmed once is not asked about again for the next lines of this delivery.
      const confirmedPlaces = new Set<string>();
      try {
        for (const row of bodies) {
          const body = containerBody(saved.id, row, note);
          const change = await sendWithConfirmation(
            (confirm) =>
              createContainer(
                confirm || confirmedPlaces.has(row.locationId) ? { ...body, confirm: true } : body,
              ),
            async (warnings, message) => {
              const yes = await confirmation.ask(warnings, message);
              if (yes) confirmedPlaces.add(row.locationId);
              return yes;
            },
          );
          if (!change) {
            // Going back before any container of a lot made just now leaves no empty lot behind.
            if (isNewLot && done.length === 0) {
              await deleteLot(saved.id);
              return null;
            }
            throw new Error(
              'You went back at a storage warning: that container and the ones after it were not received.',
            );
          }
          done.push(change);
        }
      } catch (error) {
        throw Object.assign(new Error(errorMessage(error)), { lot: saved, done, cause: error });
      }
      return { lot: saved, changes: done };
    },
    onSettled: () => queryClient.invalidateQueries({ queryKey: stockKeys.all }),
  });

  function setFieldErrors(
    prefix: string,
    fields: Record<string, string>,
    labels: Record<string, string>,
  ) {
    for (const [field, message] of Object.entries(fields)) {
      const key = field.split('.')[0] ?? field;
      if (!(key in labels)) continue;
      setError(`${prefix}${key}` as FieldPath<ReceiveValues>, {
        message: fieldMessage(labels[key] ?? key, message),
      });
    }
  }

  const onSubmit = handleSubmit((values) => {
    clearErrors();
    setPartial(null);
    if (!chemical) {
      setChemicalError('Choose the chemical that came in.');
      return;
    }
    let ok = true;
    let lot: LotCreate | Lot;
    if (values.lotMode === 'existing') {
      const existing = lots.data?.items.find((l) => String(l.id) === values.lotId);
      if (!existing) {
        setError('lotId', { message: 'Choose the lot, or record a new one.' });
        ok = false;
      }
      lot = existing as Lot;
    } else {
      lot = lotBody(chemical.id, values);
      const checked = lotCreateSchema.safeParse(lot);
      if (!checked.success) {
        ok = false;
        const fields: Record<string, string> = {};
        for (const issue of checked.error.issues) fields[String(issue.path[0])] ??= issue.message;
        setFieldErrors('', fields, lotLabels);
      }
    }
    values.containers.forEach((row, index) => {
      const checked = containerCreateSchema.safeParse(containerBody(1, row));
      if (!checked.success) {
        ok = false;
        const fields: Record<string, string> = {};
        for (const issue of checked.error.issues) fields[String(issue.path[0])] ??= issue.message;
        if (fields.locationId) fields.locationId = 'is required: choose where it is stored';
        setFieldErrors(`containers.${index}.`, fields, containerLabels);
      }
    });
    if (watchedBy && !values.note.trim()) {
      setError('note', { message: `Say why: ${chemical.name} is on ${watchedBy}` });
      ok = false;
    }
    if (!ok) return;

    receive.mutate(
      { lot, bodies: values.containers, note: values.note },
      {
        onSuccess: (result) => {
          // Went back at the first storage warning: nothing was kept, the form stays as typed.
          if (!result) return;
          const done = [...(partial?.done ?? []), ...result.changes];
          setReceived({ lot: result.lot, changes: done });
        },
        onError: (error) => {
          const failure = error as Error & { lot?: Lot; done?: ContainerChange[]; cause?: unknown };
          if (!failure.lot) {
            if (isApiError(error)) setFieldErrors('', error.fields, lotLabels);
            return;
          }
          // The lot (and maybe some containers) were saved: keep them, let the rest be fixed.
          const done = failure.done ?? [];
          setPartial({ done: [...(partial?.done ?? []), ...done], message: failure.message });
          setValue('lotMode', 'existing');
          setValue('lotId', String(failure.lot.id));
          rows.remove(done.map((_, index) => index));
          if (isApiError(failure.cause)) {
            setFieldErrors('containers.0.', failure.cause.fields, containerLabels);
            if (failure.cause.fields.note) {
              setError('note', { message: fieldMessage('Why', failure.cause.fields.note) });
            }
          }
          void lots.refetch();
        },
      },
    );
  });

  function startOver() {
    setReceived(null);
    setPartial(null);
    receive.reset();
    form.reset({
      ...getValues(),
      lotMode: 'new',
      lotId: '',
      supplierLotNumber: '',
      containers: [emptyRow(defaultUnit)],
    });
  }

  const errors = formState.errors;
  const back = (
    <Link
      to={paths.stockContainers}
      className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
    >
      <ChevronLeft aria-hidden="true" className="size-4" />
      All containers
    </Link>
  );

  if (received && chemical) {
    return (
      <div className="flex flex-col gap-5">
        {back}
        <h1 className="text-xl font-semibold text-ink-900">Stock received</h1>
        <ReceivedView received={received} chemical={chemical} onMore={startOver} />
        <SafetyCaution compact />
      </div>
    );
  }

  const count = rows.fields.length;
  return (
    <div className="flex flex-col gap-5">
      {back}
      <header>
        <h1 className="text-xl font-semibold text-ink-900">Receive stock</h1>
        <p className="max-w-3xl text-sm text-ink-600">
          A delivery in three steps: which chemical, which lot (the supplier’s batch), and the
          containers put on the shelf. Each container gets its label code when it is saved.
        </p>
      </header>

      <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
        <section
          aria-labelledby="receive-chemical-heading"
          className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-white px-4 py-3"
        >
          <h2 id="receive-chemical-heading" className="text-base font-semibold">
            1. Chemical
          </h2>
          <Field label="Chemical" error={chemicalError} id="receive-chemical">
            {(control) => (
              <ChemicalPicker
                id={control.id}
                value={chemical}
                invalid={control['aria-invalid']}
                describedBy={control['aria-describedby']}
                onChange={(next) => {
                  setChosen(next);
                  setChemicalError(undefined);
                  setValue('lotMode', 'new');
                  setValue('lotId', '');
                  if (next) {
                    rows.fields.forEach((_, index) =>
                      setValue(`containers.${index}.unit`, next.stockUnit),
                    );
                  }
                }}
              />
            )}
          </Field>
          {chemical && <SafetyCaution compact />}
        </section>

        <section
          aria-labelledby="receive-lot-heading"
          className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
        >
          <h2 id="receive-lot-heading" className="text-base font-semibold">
            2. Lot
          </h2>
          <fieldset className="flex flex-wrap gap-4 text-sm">
            <legend className="sr-only">New or recorded lot</legend>
            <label className="flex items-center gap-2">
              <input
                type="radio"
                value="new"
                {...register('lotMode')}
                className="accent-accent-600"
              />
              A new lot
            </label>
            <label className="flex items-center gap-2">
              <input
                type="radio"
                value="existing"
                disabled={!chemical || (lots.data?.items.length ?? 0) === 0}
                {...register('lotMode')}
                className="accent-accent-600"
              />
              More of a lot already recorded
              {chemical && lots.data && lots.data.items.length === 0 && (
                <span className="text-ink-600">(none yet)</span>
              )}
            </label>
          </fieldset>

          {lotMode === 'existing' ? (
            <Field label="Lot" error={errors.lotId?.message}>
              {(c) => (
                <Select {...c} className="max-w-xl" {...register('lotId')}>
                  <option value="">Choose a lot</option>
                  {(lots.data?.items ?? []).map((lot) => (
                    <option key={lot.id} value={lot.id}>
                      {[
                        lot.supplierLotNumber ? `Lot ${lot.supplierLotNumber}` : `Lot #${lot.id}`,
                        lot.supplierName,
                        lot.grade,
                        `received ${formatDate(lot.receivedOn)}`,
                        lot.expiresOn ? `expires ${formatDate(lot.expiresOn)}` : null,
                        formatPercent(lot.purityPercent),
                      ]
                        .filter(Boolean)
                        .join(' · ')}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
          ) : (
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              <Field label="Supplier" optional error={errors.supplierName?.message}>
                {(c) => <Input {...c} {...register('supplierName')} />}
              </Field>
              <Field
                label="Supplier lot number"
                optional
                hint="As on the bottle or the certificate"
                error={errors.supplierLotNumber?.message}
              >
                {(c) => <Input {...c} {...register('supplierLotNumber')} />}
              </Field>
              <Field
                label="Grade"
                optional
                hint="e.g. ACS reagent, technical"
                error={errors.grade?.message}
              >
                {(c) => <Input {...c} {...register('grade')} />}
              </Field>
              <Field
                label="Purity (%)"
                optional
                hint={
                  chemical
                    ? `Empty: the chemical’s default, ${formatPercent(chemical.defaultPurityPercent)}`
                    : undefined
                }
                error={errors.purityPercent?.message}
              >
                {(c) => <AmountInput {...c} {...register('purityPercent')} />}
              </Field>
              <Field label="Received on" error={errors.receivedOn?.message}>
                {(c) => <Input {...c} type="date" {...register('receivedOn')} />}
              </Field>
              <Field label="Expires on" optional error={errors.expiresOn?.message}>
                {(c) => <Input {...c} type="date" {...register('expiresOn')} />}
              </Field>
            </div>
          )}
        </section>

        <section
          aria-labelledby="receive-containers-heading"
          className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
        >
          <h2 id="receive-containers-heading" className="text-base font-semibold">
            3. Containers
          </h2>
          <p className="text-sm text-ink-600">
            One line per bottle, jar or bag; quantity, unit and location are needed, the rest is
            optional. The tare (empty, cap on) lets people record draws by weighing.
          </p>
          {watchedBy ? (
            <Field
              label="Reason for this delivery (required)"
              error={errors.note?.message}
              hint={`${chemical?.name ?? ''} is on ${watchedBy}: your name and this reason are recorded.`}
            >
              {(c) => <Input {...c} autoComplete="off" {...register('note')} />}
            </Field>
          ) : (
            <Field
              label="Reason for this delivery"
              optional
              error={errors.note?.message}
              hint="e.g. the order or course it is for"
            >
              {(c) => <Input {...c} autoComplete="off" {...register('note')} />}
            </Field>
          )}
          <ol className="flex flex-col gap-3">
            {rows.fields.map((row, index) => {
              const rowErrors = errors.containers?.[index];
              return (
                <li
                  key={row.id}
                  aria-label={`Container ${index + 1}`}
                  className="rounded-md border border-ink-200 bg-ink-50 px-3 py-3"
                >
                  <div className="mb-2 flex items-center justify-between gap-2">
                    <p className="text-sm font-semibold text-ink-800">Container {index + 1}</p>
                    <div className="flex gap-1">
                      <Button
                        size="sm"
                        variant="ghost"
                        onClick={() =>
                          rows.insert(index + 1, { ...getValues(`containers.${index}`) })
                        }
                        icon={<Copy aria-hidden="true" className="size-4" />}
                      >
                        Copy
                      </Button>
                      {count > 1 && (
                        <Button
                          size="sm"
                          variant="ghost"
                          onClick={() => rows.remove(index)}
                          icon={<Trash2 aria-hidden="true" className="size-4" />}
                        >
                          Remove
                        </Button>
                      )}
                    </div>
                  </div>
                  <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-[7rem_5.5rem_7rem_7rem_5.5rem_9rem_minmax(14rem,1fr)_9.5rem]">
                    <Field label="Quantity" error={rowErrors?.quantity?.message}>
                      {(c) => <AmountInput {...c} {...register(`containers.${index}.quantity`)} />}
                    </Field>
                    <Field label="Unit" error={rowErrors?.unit?.message}>
                      {(c) => (
                        <Select {...c} {...register(`containers.${index}.unit`)}>
                          {units.map((unit) => (
                            <option key={unit}>{unit}</option>
                          ))}
                        </Select>
                      )}
                    </Field>
                    <Field label="Tare (g)" error={rowErrors?.tareMass?.message}>
                      {(c) => <AmountInput {...c} {...register(`containers.${index}.tareMass`)} />}
                    </Field>
                    <Field label="Capacity" error={rowErrors?.capacity?.message}>
                      {(c) => <AmountInput {...c} {...register(`containers.${index}.capacity`)} />}
                    </Field>
                    <Field label="Cap. unit" error={rowErrors?.capacityUnit?.message}>
                      {(c) => (
                        <Select {...c} {...register(`containers.${index}.capacityUnit`)}>
                          <option value="">same</option>
                          {units.map((unit) => (
                            <option key={unit}>{unit}</option>
                          ))}
                        </Select>
                      )}
                    </Field>
                    <Field label="Material" error={rowErrors?.material?.message}>
                      {(c) => (
                        <Select {...c} {...register(`containers.${index}.material`)}>
                          <option value="">not said</option>
                          {containerMaterials.map((m) => (
                            <option key={m} value={m}>
                              {containerMaterialLabels[m]}
                            </option>
                          ))}
                        </Select>
                      )}
                    </Field>
                    <Field label="Location" error={rowErrors?.locationId?.message}>
                      {(c) => (
                        <LocationSelect
                          {...c}
                          value={Number(rowValues[index]?.locationId) || undefined}
                          onChange={(id) =>
                            setValue(`containers.${index}.locationId`, id ? String(id) : '', {
                              shouldDirty: true,
                            })
                          }
                        />
                      )}
                    </Field>
                    <Field label="Opened on" error={rowErrors?.openedOn?.message}>
                      {(c) => (
                        <Input {...c} type="date" {...register(`containers.${index}.openedOn`)} />
                      )}
                    </Field>
                  </div>
                </li>
              );
            })}
          </ol>
          <div>
            <Button
              size="sm"
              onClick={() => rows.append(emptyRow(defaultUnit))}
              icon={<Plus aria-hidden="true" className="size-4" />}
            >
              Add a container
            </Button>
          </div>
        </section>

        {partial && (
          <Notice
            tone="danger"
            title={`${countOf(partial.done.length, 'container')} saved, the rest not`}
          >
            {partial.message} The lot is kept and chosen below; correct the remaining lines and
            press Receive again.
          </Notice>
        )}
        {receive.isError && !partial && (
          <Notice tone="danger" title="Nothing was received">
            {errorMessage(receive.error)}
          </Notice>
        )}
        <div className="flex items-center gap-3">
          <Button
            type="submit"
            variant="primary"
            busy={receive.isPending}
            icon={<PackagePlus aria-hidden="true" className="size-4" />}
          >
            Receive {count} {count === 1 ? 'container' : 'containers'}
          </Button>
          {receive.isPending && (
            <span className="text-sm text-ink-600">Saving the lot and its containers…</span>
          )}
        </div>
      </form>
      {confirmation.dialog}
    </div>
  );
}
