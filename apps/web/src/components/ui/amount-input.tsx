import type { InputHTMLAttributes, Ref } from 'react';
import { cn } from '../../lib/cn';
import { Input } from './input';

/**
 * The one field for a mass, volume, amount or factor: text with the numeric keypad that has
 * a decimal mark (`inputMode="decimal"`), never `type="number"` (which refuses a decimal
 * comma in some browsers and changes with the scroll wheel). Read what it holds with
 * `parseDecimal` (lib/numbers.ts), which takes the reader's decimal mark and grouping.
 */
export function AmountInput({
  className,
  ref,
  ...rest
}: Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'inputMode'> & {
  ref?: Ref<HTMLInputElement>;
}) {
  return (
    <Input
      ref={ref}
      type="text"
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      className={cn('tabular-nums', className)}
      {...rest}
    />
  );
}
