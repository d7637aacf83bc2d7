import { useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router';
import { Printer } from 'lucide-react';
import {
  hazardousWasteWording,
  liquidClassLabels,
  wasteStatusLabels,
  type WasteContainerDetail,
} from '@lotwise/shared';
import { HazardStatementList } from '../../../components/hazards/hazard-statement-list';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { useConfirmation } from '../../../components/ui/confirmation-dialog';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { errorMessage, sendWithConfirmation } from '../../../lib/api-client';
import { formatAmount, formatDate, formatDateTime } from '../../../lib/format';
import { parseDecimal } from '../../../lib/numbers';
import { useAddWaste, useWasteContainer } from '../api';
import { ageText, fillText } from '../components/waste-table';

/** The label to print: the wording, what went in, the characteristics and the start date. */
function WasteLabel({ container }: { container: WasteContainerDetail }) {
  return (
    <section
      aria-label="Waste label"
      className="flex max-w-md flex-col gap-2 rounded border-2 border-ink-900 bg-white p-4 print:break-inside-avoid"
    >
      <p className="text-lg font-bold tracking-wide text-ink-900 uppercase">
        {hazardousWasteWording}
      </p>
      <p className="font-mono text-sm">{container.labelCode}</p>
      <p className="font-semibold text-ink-900">{container.title}</p>
      <p className="text-sm text-ink-800">
        Contents: {container.chemicals.map((c) => c.name).join(', ') || 'not named yet'}
      </p>
      <p className="text-sm text-ink-800">
        Characteristics: {container.characteristics.join(', ') || 'none marked'}
        {container.acutelyHazardous ? '; acutely hazardous' : ''}
      </p>
      <p className="text-sm text-ink-800">
        Accumulation start:{' '}
        {container.accumulationStartOn ? formatDate(container.accumulationStartOn) : '—'}
      </p>
      <PictogramList codes={container.ghsPictograms} />
    </section>
  );
}

function AddContents({ container }: { container: WasteContainerDetail }) {
  const [description, setDescription] = useState('');
  const [quantity, setQuantity] = useState('');
  const [unit, setUnit] = useState(container.capacityUnit);
  const [error, setError] = useState<string | null>(null);
  const add = useAddWaste(container.id);
  const { ask, dialog } = useConfirmation();

  async function handleSubmit(event: FormEvent) {
    event.preventDefault();
    setError(null);
    const amount = parseDecimal(quantity);
    if (amount === null || !(amount > 0)) {
      setError('Enter the approximate amount, more than 0.');
      return;
    }
    try {
      const done = await sendWithConfirmation(
        (confirm) => add.mutateAsync({ description, quantity: amount, unit, confirm }),
        ask,
      );
      if (done) {
        setDescription('');
        setQuantity('');
      }
    } catch (caught) {
      setError(errorMessage(caught));
    }
  }

  return (
    <form onSubmit={handleSubmit} aria-label="Add contents" className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-[2fr_1fr_1fr]">
        <Field label="What went in" hint="e.g. washings of the ester prep">
          {(control) => (
            <Input
              {...control}
              required
              value={description}
              onChange={(e) => setDescription(e.target.value)}
            />
          )}
        </Field>
        <Field label="About how much">
          {(control) => (
            <Input
              {...control}
              inputMode="decimal"
              required
              value={quantity}
              onChange={(e) => setQuantity(e.target.value)}
            />
          )}
        </Field>
        <Field label="Unit">
          {(control) => (
            <Input {...control} required value={unit} onChange={(e) => setUnit(e.target.value)} />
          )}
        </Field>
      </div>
      {error && (
        <p role="alert" className="text-sm text-danger-700">
          {error}
        </p>
      )}
      <div>
        <Button type="submit" variant="primary" busy={add.isPending}>
          Add to {container.labelCode}
        </Button>
      </div>
      {dialog}
    </form>
  );
}

export function WasteContainerPage() {
  const id = Number(useParams().id);
  const container = useWasteContainer(id);
  if (container.isPending) return <PageSpinner label="Loading the waste container…" />;
  if (container.isError) {
    return (
      <ErrorState
        title="The waste container could not be loaded"
        error={container.error}
        onRetry={() => void container.refetch()}
      />
    );
  }
  const c = container.data;
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        <p className="text-sm">
          <Link
            to={paths.stockWaste}
            className="text-accent-700 underline-offset-2 hover:underline"
          >
            Waste
          </Link>
        </p>
        <h1 className="text-xl font-semibold text-ink-900">
          <span className="font-mono">{c.labelCode}</span> {c.title}
        </h1>
        <p className="text-sm text-ink-700">
          {c.locationPath} · {wasteStatusLabels[c.status]} · {fillText(c)} · accumulating for{' '}
          {ageText(c)}
        </p>
        {c.liquidClass && (
          <p className="text-sm text-ink-700">
            Counts toward the flammable-liquid limits as {liquidClassLabels[c.liquidClass]}.
            {c.liquidClassNote ? ` ${c.liquidClassNote}` : ''}
          </p>
        )}
      </header>
      <SafetyCaution />

      <section aria-labelledby="waste-hazards" className="flex flex-col gap-3">
        <h2 id="waste-hazards" className="font-semibold text-ink-900">
          Hazards of what went in
        </h2>
        {c.chemicals.length === 0 ? (
          <p className="text-sm text-ink-600">
            No chemical is named in the additions: check what went in and its SDS.
          </p>
        ) : (
          <ul className="flex flex-col gap-3">
            {c.chemicals.map((chemical) => (
              <li key={chemical.id} className="flex flex-col gap-1">
                <Link
                  to={paths.chemical(chemical.id)}
                  className="font-medium text-accent-700 underline-offset-2 hover:underline"
                >
                  {chemical.name}
                </Link>
                <PictogramList codes={chemical.ghsPictograms} />
                <HazardStatementList codes={chemical.hazardStatements} />
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="waste-additions" className="flex flex-col gap-2">
        <h2 id="waste-additions" className="font-semibold text-ink-900">
          Contents added so far
        </h2>
        {c.additions.length === 0 ? (
          <p className="text-sm text-ink-600">Nothing yet.</p>
        ) : (
          <ul className="flex flex-col gap-1 text-sm text-ink-800">
            {c.additions.map((a) => (
              <li key={a.id}>
                {formatDateTime(a.addedAt)} — {a.description}, about{' '}
                {formatAmount(a.quantity, a.unit)}
                {a.chemicals.length > 0 && ` (${a.chemicals.map((x) => x.name).join(', ')})`}
                {a.runId !== null && (
                  <>
                    {' '}
                    from{' '}
                    <Link
                      to={paths.run(a.runId)}
                      className="text-accent-700 underline underline-offset-2"
                    >
                      run #{a.runId}
                    </Link>
                  </>
                )}
                {a.addedByName && ` · ${a.addedByName}`}
              </li>
            ))}
          </ul>
        )}
      </section>

      {c.status === 'open' && (
        <section aria-labelledby="waste-add" className="flex flex-col gap-2">
          <h2 id="waste-add" className="font-semibold text-ink-900">
            Add contents
          </h2>
          <AddContents container={c} />
        </section>
      )}

      <section aria-labelledby="waste-label" className="flex flex-col gap-2">
        <div className="flex items-center justify-between gap-3 print:hidden">
          <h2 id="waste-label" className="font-semibold text-ink-900">
            Label
          </h2>
          <Button icon={<Printer aria-hidden="true" />} onClick={() => window.print()}>
            Print the label
          </Button>
        </div>
        <WasteLabel container={c} />
      </section>
    </div>
  );
}
