import { useState, type FormEvent } from 'react';
import { Send, X } from 'lucide-react';
import { requestCreateSchema, type Chemical } from '@lotwise/shared';
import { ChemicalSearchBox } from '../../../components/chem/chemical-search-box';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Input, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { formatAmount } from '../../../lib/format';
import { useCreateRequest } from '../api';

/** "I need 50 g of X by March": a member asks the coordinator to buy a chemical. */
export function RequestForm() {
  const [chemical, setChemical] = useState<Chemical | null>(null);
  const [quantity, setQuantity] = useState('');
  const [neededBy, setNeededBy] = useState('');
  const [note, setNote] = useState('');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [sent, setSent] = useState<string | null>(null);
  const create = useCreateRequest();

  function handleSubmit(event: FormEvent) {
    event.preventDefault();
    setSent(null);
    const body = {
      chemicalId: chemical?.id ?? 0,
      quantity: quantity.trim() === '' ? Number.NaN : Number(quantity),
      unit: chemical?.stockUnit ?? 'g',
      neededBy: neededBy || null,
      note,
    };
    // The same schema the server checks with.
    const parsed = requestCreateSchema.safeParse(body);
    if (!parsed.success) {
      setFields(
        Object.fromEntries(
          parsed.error.issues.map((issue) => [String(issue.path[0]), issue.message]),
        ),
      );
      return;
    }
    setFields({});
    create.mutate(body, {
      onSuccess: (request) => {
        setSent(
          `Asked for ${formatAmount(request.quantity, request.unit)} of ${request.chemical.name}.`,
        );
        setChemical(null);
        setQuantity('');
        setNeededBy('');
        setNote('');
      },
      onError: (error) => {
        if (isApiError(error)) setFields(error.fields);
      },
    });
  }

  return (
    <form
      aria-labelledby="request-form-heading"
      onSubmit={handleSubmit}
      noValidate
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white p-4"
    >
      <h2 id="request-form-heading" className="text-base font-semibold text-ink-900">
        Request a chemical
      </h2>
      <p className="text-sm text-ink-600">
        Say what you need and by when; the coordinator adds it to the next shared order as your
        share, and you pay for your part only.
      </p>
      {chemical ? (
        <div className="flex flex-col gap-2 rounded-md border border-ink-200 bg-ink-50 px-3 py-2">
          <div className="flex items-start justify-between gap-2">
            <p className="font-medium text-ink-900">
              {chemical.name}{' '}
              <span className="text-xs font-normal text-ink-600">
                (counted in {chemical.stockUnit})
              </span>
            </p>
            <Button
              size="sm"
              variant="ghost"
              icon={<X aria-hidden="true" className="size-4" />}
              onClick={() => setChemical(null)}
            >
              Other chemical
            </Button>
          </div>
          <HazardCodes pictograms={chemical.ghsPictograms} statements={chemical.hazardStatements} />
          <SafetyCaution compact />
        </div>
      ) : (
        <Field label="Chemical" error={fields.chemicalId}>
          {(control) => (
            <ChemicalSearchBox
              id={control.id}
              describedBy={control['aria-describedby']}
              invalid={control['aria-invalid']}
              onChoose={(chosen) => {
                setChemical(chosen);
                setFields((current) => ({ ...current, chemicalId: '' }));
              }}
            />
          )}
        </Field>
      )}
      <div className="grid gap-3 sm:grid-cols-2">
        <Field
          label={`Quantity${chemical ? ` (${chemical.stockUnit})` : ''}`}
          error={fields.quantity || fields.unit}
        >
          {(control) => (
            <AmountInput
              {...control}
              value={quantity}
              onChange={(event) => setQuantity(event.target.value)}
            />
          )}
        </Field>
        <Field label="Needed by" optional error={fields.neededBy}>
          {(control) => (
            <Input
              {...control}
              type="date"
              value={neededBy}
              onChange={(event) => setNeededBy(event.target.value)}
            />
          )}
        </Field>
      </div>
      <Field label="Note for the coordinator" optional error={fields.note}>
        {(control) => (
          <Textarea
            {...control}
            rows={2}
            value={note}
            onChange={(event) => setNote(event.target.value)}
          />
        )}
      </Field>
      {create.isError && !isApiError(create.error) && (
        <Notice tone="danger">{errorMessage(create.error)}</Notice>
      )}
      {create.isError &&
        isApiError(create.error) &&
        Object.keys(create.error.fields).length === 0 && (
          <Notice tone="danger">{create.error.message}</Notice>
        )}
      {sent && <Notice tone="ok">{sent}</Notice>}
      <div>
        <Button
          type="submit"
          variant="primary"
          busy={create.isPending}
          icon={<Send aria-hidden="true" className="size-4" />}
        >
          Send request
        </Button>
      </div>
    </form>
  );
}
