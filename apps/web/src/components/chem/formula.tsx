import { Fragment } from 'react';

/**
 * Displays a formula with its atom counts as subscripts: `C6H12O6` -> C₆H₁₂O₆. Only the
 * typography is done here; digits that open a hydrate part (`·5H2O`) stay full size.
 */
export function Formula({ value }: { value: string | null | undefined }) {
  if (!value) return <span className="text-ink-500">—</span>;
  const parts = value.match(/\d+|\D+/g) ?? [];
  return (
    <span className="whitespace-nowrap">
      {parts.map((part, index) => {
        const previous = index > 0 ? (parts[index - 1] ?? '') : '';
        const isCount = /^\d+$/.test(part) && /[A-Za-z)\]]$/.test(previous);
        return isCount ? (
          <sub key={index} className="text-[0.75em]">
            {part}
          </sub>
        ) : (
          <Fragment key={index}>{part}</Fragment>
        );
      })}
    </span>
  );
}
