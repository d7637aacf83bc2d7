import type { InputHTMLAttributes, Ref, SelectHTMLAttributes, TextareaHTMLAttributes } from 'react';
import { cn } from '../../lib/cn';

const control =
  'w-full rounded-md border bg-white px-2.5 text-sm text-ink-900 placeholder:text-ink-500 transition-colors disabled:bg-ink-100 disabled:text-ink-500 aria-[invalid=true]:border-danger-600';
const border = 'border-ink-300 hover:border-ink-400';
/** With a finger: 44 px high, and 16 px text so a phone does not zoom into the field. */
const coarse = 'pointer-coarse:h-11 pointer-coarse:text-base';

export function Input({
  className,
  ref,
  ...rest
}: InputHTMLAttributes<HTMLInputElement> & { ref?: Ref<HTMLInputElement> }) {
  return <input ref={ref} className={cn(control, border, 'h-9', coarse, className)} {...rest} />;
}

export function Textarea({
  className,
  ref,
  ...rest
}: TextareaHTMLAttributes<HTMLTextAreaElement> & { ref?: Ref<HTMLTextAreaElement> }) {
  return (
    <textarea
      ref={ref}
      className={cn(control, border, 'py-2 leading-6 pointer-coarse:text-base', className)}
      {...rest}
    />
  );
}

export function Select({
  className,
  ref,
  children,
  ...rest
}: SelectHTMLAttributes<HTMLSelectElement> & { ref?: Ref<HTMLSelectElement> }) {
  return (
    <select ref={ref} className={cn(control, border, 'h-9 pr-1', coarse, className)} {...rest}>
      {children}
    </select>
  );
}

export function Checkbox({
  className,
  ref,
  ...rest
}: Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & { ref?: Ref<HTMLInputElement> }) {
  return (
    <input
      ref={ref}
      type="checkbox"
      className={cn(
        'size-4 rounded border-ink-400 accent-accent-600 pointer-coarse:size-5',
        className,
      )}
      {...rest}
    />
  );
}
