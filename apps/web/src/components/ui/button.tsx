import type { ButtonHTMLAttributes, ReactNode, Ref } from 'react';
import { cn } from '../../lib/cn';
import { Spinner } from './spinner';

export type ButtonVariant = 'primary' | 'secondary' | 'ghost' | 'danger';
export type ButtonSize = 'sm' | 'md';

const variants: Record<ButtonVariant, string> = {
  primary:
    'bg-accent-600 text-white border border-accent-700 hover:bg-accent-700 disabled:bg-accent-300 disabled:border-accent-300',
  secondary:
    'bg-white text-ink-800 border border-ink-300 hover:bg-ink-100 hover:border-ink-400 disabled:text-ink-400',
  ghost:
    'bg-transparent text-ink-700 border border-transparent hover:bg-ink-100 disabled:text-ink-400',
  danger:
    'bg-danger-600 text-white border border-danger-700 hover:bg-danger-700 disabled:opacity-60',
};

// With a finger (a phone or tablet, gloves on) every button is at least 44 px each way.
const sizes: Record<ButtonSize, string> = {
  sm: 'h-8 px-2.5 text-sm gap-1.5 pointer-coarse:h-11 pointer-coarse:min-w-11',
  md: 'h-9 px-3.5 text-sm gap-2 pointer-coarse:h-11 pointer-coarse:min-w-11',
};

/** Classes of a button, for links that should look like one. */
export function buttonClasses(
  variant: ButtonVariant = 'secondary',
  size: ButtonSize = 'md',
): string {
  return cn(
    'inline-flex items-center justify-center rounded-md font-medium whitespace-nowrap transition-colors disabled:cursor-not-allowed',
    variants[variant],
    sizes[size],
  );
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  ref?: Ref<HTMLButtonElement>;
  variant?: ButtonVariant;
  size?: ButtonSize;
  icon?: ReactNode;
  /** Shows a spinner and disables the button while an action is under way. */
  busy?: boolean;
}

export function Button({
  variant = 'secondary',
  size = 'md',
  icon,
  busy = false,
  className,
  children,
  disabled,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={cn(buttonClasses(variant, size), className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? <Spinner size="sm" /> : icon}
      {children}
    </button>
  );
}
