import { useState, type FormEvent } from 'react';
import type { Supplier, SupplierCreate } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, fieldMessage } from '../../../components/ui/field';
import { Input, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { useCreateSupplier, useUpdateSupplier } from '../api';
import { moneyInputText, parseMoneyInput } from '../money';
import { MoneyField } from './money-field';

type TextField = 'name' | 'contactName' | 'email' | 'phone' | 'website' | 'orderingNotes';
type MoneyKey = 'minimumOrderMinor' | 'shippingFeeMinor' | 'hazardousFeeMinor';
type Values = Record<TextField | MoneyKey, string>;

const labels: Record<TextField | MoneyKey, string> = {
  name: 'Name',
  contactName: 'Contact person',
  email: 'Order e-mail',
  phone: 'Phone',
  website: 'Website',
  orderingNotes: 'How to order',
  minimumOrderMinor: 'Minimum order',
  shippingFeeMinor: 'Shipping fee',
  hazardousFeeMinor: 'Hazardous-goods fee',
};

function initial(supplier: Supplier | null, currency: string): Values {
  const money = (minor: number | undefined) => moneyInputText(minor ?? 0, currency);
  return {
    name: supplier?.name ?? '',
    contactName: supplier?.contactName ?? '',
    email: supplier?.email ?? '',
    phone: supplier?.phone ?? '',
    website: supplier?.website ?? '',
    orderingNotes: supplier?.orderingNotes ?? '',
    minimumOrderMinor: money(supplier?.minimumOrderMinor),
    shippingFeeMinor: money(supplier?.shippingFeeMinor),
    hazardousFeeMinor: money(supplier?.hazardousFeeMinor),
  };
}

/** Adds a supplier, or edits one: contact, how to order, and the fees every order pays. */
export function SupplierFormDialog({
  open,
  onClose,
  supplier,
  currency,
  onSaved,
}: {
  open: boolean;
  onClose: () => void;
  /** Null to add a new supplier. */
  supplier: Supplier | null;
  currency: string;
  onSaved?: (supplier: Supplier) => void;
}) {
  const create = useCreateSupplier();
  const update = useUpdateSupplier(supplier?.id ?? 0);
  const save = supplier ? update : create;
  const [values, setValues] = useState<Values>(() => initial(supplier, currency));
  const [errors, setErrors] = useState<Partial<Record<keyof Values, string>>>({});

  const set = (key: keyof Values) => (text: string) => setValues((v) => ({ ...v, [key]: text }));

  function handleClose() {
    setValues(initial(supplier, currency));
    setErrors({});
    save.reset();
    onClose();
  }

  async function handleSubmit(event: FormEvent) {
    event.preventDefault();
    const found: Partial<Record<keyof Values, string>> = {};
    if (values.name.trim() === '') found.name = 'Name is required';
    const amounts = {} as Record<MoneyKey, number>;
    for (const key of ['minimumOrderMinor', 'shippingFeeMinor', 'hazardousFeeMinor'] as const) {
      const parsed = parseMoneyInput(values[key], currency);
      if (parsed.error !== null) found[key] = fieldMessage(labels[key], parsed.error);
      else amounts[key] = parsed.minor;
    }
    setErrors(found);
    if (Object.keys(found).length > 0) return;
    const body: SupplierCreate = {
      name: values.name,
      contactName: values.contactName,
      email: values.email.trim(),
      phone: values.phone,
      website: values.website,
      orderingNotes: values.orderingNotes,
      ...amounts,
    };
    try {
      const saved = await save.mutateAsync(body);
      onSaved?.(saved);
      handleClose();
    } catch (error) {
      if (!isApiError(error)) return;
      const server: Partial<Record<keyof Values, string>> = {};
      for (const [path, message] of Object.entries(error.fields)) {
        const key = path.split('.')[0] as keyof Values;
        if (key in labels) server[key] = fieldMessage(labels[key], message);
      }
      setErrors(server);
    }
  }

  const text = (key: TextField, options: { hint?: string; type?: string; optional?: boolean }) => (
    <Field label={labels[key]} hint={options.hint} error={errors[key]} optional={options.optional}>
      {(control) => (
        <Input
          {...control}
          name={key}
          type={options.type ?? 'text'}
          value={values[key]}
          onChange={(event) => set(key)(event.target.value)}
        />
      )}
    </Field>
  );

  const unmapped =
    save.isError && !(isApiError(save.error) && Object.keys(save.error.fields).length > 0);

  return (
    <Dialog
      open={open}
      onClose={handleClose}
      title={supplier ? `Edit ${supplier.name}` : 'Add a supplier'}
      description="Where the lab buys, how to order there, and the fees each order pays. Amounts in the lab’s currency."
      footer={
        <>
          <Button onClick={handleClose}>Cancel</Button>
          <Button variant="primary" type="submit" form="supplier-form" busy={save.isPending}>
            {supplier ? 'Save changes' : 'Add supplier'}
          </Button>
        </>
      }
    >
      <form id="supplier-form" noValidate onSubmit={handleSubmit} className="flex flex-col gap-4">
        {unmapped && (
          <Notice tone="danger" title="Nothing was saved">
            {errorMessage(save.error)}
          </Notice>
        )}
        {text('name', {})}
        <div className="grid gap-4 sm:grid-cols-2">
          {text('contactName', { optional: true })}
          {text('email', { type: 'email', optional: true, hint: 'Where orders are sent.' })}
          {text('phone', { type: 'tel', optional: true })}
          {text('website', { optional: true })}
        </div>
        <Field
          label={labels.orderingNotes}
          optional
          hint="Account number, order form, cut-off times, delivery quirks: what the next coordinator needs to know."
          error={errors.orderingNotes}
        >
          {(control) => (
            <Textarea
              {...control}
              name="orderingNotes"
              rows={3}
              value={values.orderingNotes}
              onChange={(event) => set('orderingNotes')(event.target.value)}
            />
          )}
        </Field>
        <div className="grid gap-4 sm:grid-cols-3">
          <MoneyField
            name="minimumOrderMinor"
            label={labels.minimumOrderMinor}
            hint="Goods only, before fees; 0 for none."
            currency={currency}
            value={values.minimumOrderMinor}
            onChange={set('minimumOrderMinor')}
            error={errors.minimumOrderMinor}
          />
          <MoneyField
            name="shippingFeeMinor"
            label={labels.shippingFeeMinor}
            hint="Charged once per order."
            currency={currency}
            value={values.shippingFeeMinor}
            onChange={set('shippingFeeMinor')}
            error={errors.shippingFeeMinor}
          />
          <MoneyField
            name="hazardousFeeMinor"
            label={labels.hazardousFeeMinor}
            hint="Once per order holding any hazardous-goods item."
            currency={currency}
            value={values.hazardousFeeMinor}
            onChange={set('hazardousFeeMinor')}
            error={errors.hazardousFeeMinor}
          />
        </div>
      </form>
    </Dialog>
  );
}
