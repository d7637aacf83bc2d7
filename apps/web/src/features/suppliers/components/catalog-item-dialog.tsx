import { useState, type FormEvent } from 'react';
import {
  packUnits,
  type CatalogItem,
  type CatalogItemCreate,
  type PackUnit,
  type PurchasingChemical,
} from '@lotwise/shared';
import { Trash2 } from 'lucide-react';
import { ChemicalSearchBox } from '../../../components/chem/chemical-search-box';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, fieldMessage } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Checkbox, Input, Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { useDeleteCatalogItem, useSaveCatalogItem } from '../api';
import { moneyInputText, parseMoneyInput } from '../money';
import { MoneyField } from './money-field';

interface Values {
  chemical: PurchasingChemical | null;
  sku: string;
  packSize: string;
  packUnit: PackUnit;
  grade: string;
  purityPercent: string;
  price: string;
  hazardous: boolean;
  splittable: boolean;
  discontinued: boolean;
}
type Key = keyof Values;

const labels: Record<Key, string> = {
  chemical: 'Chemical',
  sku: 'Supplier’s article number (SKU)',
  packSize: 'Pack size',
  packUnit: 'Unit',
  grade: 'Grade',
  purityPercent: 'Purity %',
  price: 'Price per pack',
  hazardous: 'Ships as hazardous goods',
  splittable: 'Members may claim part of a pack',
  discontinued: 'No longer sold',
};
/** Server field names that differ from the form's. */
const serverField: Record<string, Key> = { chemicalId: 'chemical', priceMinor: 'price' };

function initial(item: CatalogItem | null, currency: string): Values {
  return {
    chemical: item?.chemical ?? null,
    sku: item?.sku ?? '',
    packSize: item ? String(item.packSize) : '',
    packUnit: item?.packUnit ?? 'g',
    grade: item?.grade ?? '',
    purityPercent: item?.purityPercent === null || !item ? '' : String(item.purityPercent),
    price: item ? moneyInputText(item.priceMinor, currency) : '',
    hazardous: item?.hazardous ?? false,
    splittable: item?.splittable ?? false,
    discontinued: item?.discontinued ?? false,
  };
}

function decimal(text: string): number | null {
  const normalized = text.trim().replace(',', '.');
  return /^(\d+\.?\d*|\.\d+)$/.test(normalized) ? Number(normalized) : null;
}

/** Adds a pack to a supplier's catalogue, or edits, discontinues or deletes one. */
export function CatalogItemDialog({
  open,
  onClose,
  supplierId,
  item,
  currency,
}: {
  open: boolean;
  onClose: () => void;
  supplierId: number;
  /** Null to add a new item. */
  item: CatalogItem | null;
  currency: string;
}) {
  const save = useSaveCatalogItem(item?.id ?? null);
  const remove = useDeleteCatalogItem();
  const [values, setValues] = useState<Values>(() => initial(item, currency));
  const [errors, setErrors] = useState<Partial<Record<Key, string>>>({});
  const set = <K extends Key>(key: K, value: Values[K]) =>
    setValues((v) => ({ ...v, [key]: value }));

  function handleClose() {
    save.reset();
    remove.reset();
    onClose();
  }

  async function handleSubmit(event: FormEvent) {
    event.preventDefault();
    const found: Partial<Record<Key, string>> = {};
    if (!values.chemical) found.chemical = 'Choose the chemical this pack holds';
    if (values.sku.trim() === '') found.sku = `${labels.sku} is required`;
    const packSize = decimal(values.packSize);
    if (packSize === null || packSize <= 0)
      found.packSize = 'Pack size must be a number more than 0, such as 500 or 2.5';
    const purity = values.purityPercent.trim() === '' ? null : decimal(values.purityPercent);
    if (values.purityPercent.trim() !== '' && (purity === null || purity <= 0 || purity > 100))
      found.purityPercent = 'Purity must be more than 0 and at most 100 %';
    const price = parseMoneyInput(values.price, currency);
    if (price.error !== null) found.price = fieldMessage(labels.price, price.error);
    setErrors(found);
    if (Object.keys(found).length > 0 || !values.chemical || price.minor === null) return;
    const body = {
      chemicalId: values.chemical.id,
      sku: values.sku,
      packSize: packSize!,
      packUnit: values.packUnit,
      grade: values.grade.trim() === '' ? null : values.grade,
      purityPercent: purity,
      priceMinor: price.minor,
      currency,
      hazardous: values.hazardous,
      splittable: values.splittable,
    };
    try {
      await save.mutateAsync(
        item
          ? { ...body, discontinued: values.discontinued }
          : ({ ...body, supplierId } as CatalogItemCreate),
      );
      handleClose();
    } catch (error) {
      if (!isApiError(error)) return;
      const server: Partial<Record<Key, string>> = {};
      for (const [path, message] of Object.entries(error.fields)) {
        const name = path.split('.')[0]!;
        const key = (serverField[name] ?? name) as Key;
        if (key in labels) server[key] = fieldMessage(labels[key], message);
      }
      setErrors(server);
    }
  }

  async function handleDelete() {
    if (!item) return;
    try {
      await remove.mutateAsync(item.id);
      handleClose();
    } catch {
      // the notice below says why (e.g. orders name the item: discontinue it instead)
    }
  }

  const unmapped =
    save.isError && !(isApiError(save.error) && Object.keys(save.error.fields).length > 0);

  return (
    <Dialog
      open={open}
      onClose={handleClose}
      title={item ? `Edit ${item.sku}` : 'Add a catalogue item'}
      description="One pack size of one chemical, at the supplier’s price."
      footer={
        <>
          {item && (
            <Button
              variant="danger"
              className="mr-auto"
              busy={remove.isPending}
              onClick={() => void handleDelete()}
              icon={<Trash2 aria-hidden="true" className="size-4" />}
            >
              Delete item
            </Button>
          )}
          <Button onClick={handleClose}>Cancel</Button>
          <Button variant="primary" type="submit" form="catalog-item-form" busy={save.isPending}>
            {item ? 'Save changes' : 'Add item'}
          </Button>
        </>
      }
    >
      <form
        id="catalog-item-form"
        noValidate
        onSubmit={handleSubmit}
        className="flex flex-col gap-4"
      >
        {(unmapped || remove.isError) && (
          <Notice tone="danger" title="Nothing was changed">
            {errorMessage(unmapped ? save.error : remove.error)}
          </Notice>
        )}
        <Field
          label={labels.chemical}
          error={errors.chemical}
          hint={
            values.chemical
              ? undefined
              : 'Type part of the name, a synonym, the CAS RN or the formula.'
          }
        >
          {(control) =>
            values.chemical ? (
              <div className="flex flex-wrap items-start justify-between gap-3 rounded-md border border-ink-200 bg-ink-50 px-3 py-2.5">
                <div className="flex flex-col gap-1">
                  <p className="font-semibold text-ink-900">{values.chemical.name}</p>
                  <p className="text-sm text-ink-600 tabular-nums">
                    {values.chemical.casNumber
                      ? `CAS RN ${values.chemical.casNumber}`
                      : 'No CAS RN'}
                  </p>
                  <HazardCodes
                    pictograms={values.chemical.ghsPictograms}
                    statements={values.chemical.hazardStatements}
                  />
                </div>
                <Button size="sm" onClick={() => set('chemical', null)}>
                  Choose another
                </Button>
              </div>
            ) : (
              <ChemicalSearchBox
                id={control.id}
                invalid={control['aria-invalid']}
                describedBy={control['aria-describedby']}
                onChoose={(chemical) =>
                  set('chemical', {
                    id: chemical.id,
                    name: chemical.name,
                    casNumber: chemical.casNumber,
                    ghsPictograms: chemical.ghsPictograms,
                    hazardStatements: chemical.hazardStatements,
                  })
                }
              />
            )
          }
        </Field>
        <Field label={labels.sku} error={errors.sku}>
          {(control) => (
            <Input
              {...control}
              name="sku"
              className="max-w-60 font-mono"
              value={values.sku}
              onChange={(event) => set('sku', event.target.value)}
            />
          )}
        </Field>
        <div className="grid gap-4 sm:grid-cols-[10rem_7rem_1fr]">
          <Field label={labels.packSize} error={errors.packSize}>
            {(control) => (
              <AmountInput
                {...control}
                name="packSize"
                className="text-right tabular-nums"
                value={values.packSize}
                onChange={(event) => set('packSize', event.target.value)}
              />
            )}
          </Field>
          <Field label={labels.packUnit} error={errors.packUnit}>
            {(control) => (
              <Select
                {...control}
                name="packUnit"
                value={values.packUnit}
                onChange={(event) => set('packUnit', event.target.value as PackUnit)}
              >
                {packUnits.map((unit) => (
                  <option key={unit} value={unit}>
                    {unit}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <MoneyField
            name="price"
            label={labels.price}
            currency={currency}
            value={values.price}
            onChange={(text) => set('price', text)}
            error={errors.price}
          />
        </div>
        <div className="grid gap-4 sm:grid-cols-[1fr_8rem]">
          <Field
            label={labels.grade}
            optional
            error={errors.grade}
            hint="e.g. ACS reagent, technical."
          >
            {(control) => (
              <Input
                {...control}
                name="grade"
                value={values.grade}
                onChange={(event) => set('grade', event.target.value)}
              />
            )}
          </Field>
          <Field label={labels.purityPercent} optional error={errors.purityPercent}>
            {(control) => (
              <AmountInput
                {...control}
                name="purityPercent"
                className="text-right tabular-nums"
                value={values.purityPercent}
                onChange={(event) => set('purityPercent', event.target.value)}
              />
            )}
          </Field>
        </div>
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 text-sm font-medium text-ink-800">Shipping and sharing</legend>
          {(['hazardous', 'splittable', ...(item ? (['discontinued'] as const) : [])] as const).map(
            (key) => (
              <label key={key} className="flex items-start gap-2 text-sm">
                <Checkbox
                  name={key}
                  className="mt-0.5"
                  checked={values[key]}
                  onChange={(event) => set(key, event.target.checked)}
                />
                <span>
                  {labels[key]}
                  <span className="block text-xs text-ink-600">
                    {key === 'hazardous'
                      ? 'An order holding this pack pays the supplier’s hazardous-goods fee.'
                      : key === 'splittable'
                        ? 'e.g. 100 g of a 500 g pack; otherwise members claim whole packs.'
                        : 'Kept for the orders that name it, left out of new ones.'}
                  </span>
                </span>
              </label>
            ),
          )}
        </fieldset>
        {values.chemical && <SafetyCaution compact />}
      </form>
    </Dialog>
  );
}
