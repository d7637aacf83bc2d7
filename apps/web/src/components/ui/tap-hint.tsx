import { useId, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

/**
 * A short code whose meaning would otherwise sit in a hover tooltip: a tap, a click or Enter
 * opens the meaning in a small note (the browser's popover, closed by a tap elsewhere or
 * Escape); a mouse still gets the tooltip. Screen readers get the meaning from `srText`.
 */
export function TapHint({
  hint,
  srText,
  className,
  children,
}: {
  /** The words shown on a tap. */
  hint: string;
  /** Read with the code, instead of opening the note. */
  srText?: string;
  className?: string;
  children: ReactNode;
}) {
  const id = useId();
  return (
    <>
      <button
        type="button"
        popoverTarget={id}
        title={hint}
        className={cn('cursor-help rounded', className)}
      >
        {children}
        {srText && <span className="sr-only"> {srText}</span>}
      </button>
      {/* The words come from `data-hint` through CSS: shown to the eye on a tap, not read
          twice (the button already carries them). */}
      <span
        id={id}
        popover="auto"
        aria-hidden="true"
        data-hint={hint}
        className="m-auto max-w-xs rounded-md border border-ink-300 bg-white px-3 py-2 text-sm text-ink-900 shadow-lg before:content-[attr(data-hint)]"
      />
    </>
  );
}
