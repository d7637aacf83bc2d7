import { useId, type ReactNode } from 'react';
import { CircleAlert } from 'lucide-react';
import { cn } from '../../lib/cn';

export interface FieldControlProps {
  id: string;
  'aria-describedby'?: string;
  'aria-invalid'?: boolean;
}

interface FieldProps {
  label: ReactNode;
  /** Shown under the control while there is no error. */
  hint?: ReactNode;
  error?: string;
  /** Extra line under the control that updates live (e.g. a computed preview). */
  live?: ReactNode;
  optional?: boolean;
  className?: string;
  id?: string;
  children: (control: FieldControlProps) => ReactNode;
}

/** A label, its control, a hint and an inline error, wired together for assistive tech. */
export function Field({ label, hint, error, live, optional, className, id, children }: FieldProps) {
  const generated = useId();
  const controlId = id ?? generated;
  const hintId = `${controlId}-hint`;
  const errorId = `${controlId}-error`;
  const liveId = `${controlId}-live`;
  const describedBy =
    [error ? errorId : null, live ? liveId : null, hint ? hintId : null]
      .filter(Boolean)
      .join(' ') || undefined;

  return (
    <div className={cn('flex flex-col gap-1', className)}>
      <label htmlFor={controlId} className="text-sm font-medium text-ink-800">
        {label}
        {optional && <span className="ml-1.5 font-normal text-ink-600">(optional)</span>}
      </label>
      {children({
        id: controlId,
        'aria-describedby': describedBy,
        'aria-invalid': error ? true : undefined,
      })}
      {live && (
        <div id={liveId} aria-live="polite" className="text-sm">
          {live}
        </div>
      )}
      {error && <FieldError id={errorId}>{error}</FieldError>}
      {hint && (
        <p id={hintId} className="text-xs leading-5 text-ink-600">
          {hint}
        </p>
      )}
    </div>
  );
}

export function FieldError({ id, children }: { id?: string; children: ReactNode }) {
  return (
    <p id={id} className="flex items-start gap-1.5 text-sm text-danger-700">
      <CircleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
      <span>{children}</span>
    </p>
  );
}

/**
 * Turns a schema message such as `is required` or `must be greater than 0 g/mL` into a
 * sentence naming the field; a message that already reads as a sentence is kept.
 */
export function fieldMessage(label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  if (/^(is|are|must|cannot|can|lists|has|needs|should)\b/.test(message))
    return `${label} ${message}`;
  return message.charAt(0).toUpperCase() + message.slice(1);
}
