import { Field } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';

/** An amount typed as "12.50" in the lab's currency; the form turns it into minor units. */
export function MoneyField({
  label,
  hint,
  value,
  onChange,
  currency,
  error,
  name,
}: {
  label: string;
  hint?: string;
  value: string;
  onChange: (text: string) => void;
  currency: string;
  error?: string;
  name: string;
}) {
  return (
    <Field label={`${label} (${currency})`} hint={hint} error={error}>
      {(control) => (
        <AmountInput
          {...control}
          name={name}
          placeholder="0.00"
          className="max-w-40 text-right tabular-nums"
          value={value}
          onChange={(event) => onChange(event.target.value)}
        />
      )}
    </Field>
  );
}
