import { ghsPictograms, type GhsCode } from '@lotwise/shared';
import { TapHint } from '../ui/tap-hint';
import { PictogramSymbol } from './pictogram-symbols';

/** `GHS02 Flame: Flammable` — the words every pictogram travels with. */
export function pictogramText(code: GhsCode): string {
  const { symbol, meaning } = ghsPictograms[code];
  return `${code} ${symbol}: ${meaning}`;
}

/**
 * A GHS pictogram with its code always visible. Compact badges keep the symbol name and
 * meaning as screen-reader text, and show it on a tap (or hover); large ones show everything.
 */
export function PictogramBadge({ code, size = 'sm' }: { code: GhsCode; size?: 'sm' | 'lg' }) {
  const { symbol, meaning } = ghsPictograms[code];
  if (size === 'lg') {
    return (
      <span className="flex items-start gap-3 rounded-lg border border-ink-200 bg-white p-3">
        <PictogramSymbol code={code} size={60} className="shrink-0" />
        <span className="flex flex-col">
          <span className="text-xs font-semibold tracking-wide text-ink-600 tabular-nums">
            {code}
          </span>
          <span className="font-semibold text-ink-900">{symbol}</span>
          <span className="text-sm leading-5 text-ink-700">{meaning}</span>
        </span>
      </span>
    );
  }
  return (
    <span className="inline-flex">
      <TapHint
        hint={pictogramText(code)}
        srText={`${symbol}: ${meaning}`}
        className="inline-flex items-center gap-0.5 border border-ink-200 bg-white py-px pr-1 pl-px"
      >
        <PictogramSymbol code={code} size={22} />
        <span className="text-xs font-medium text-ink-700 tabular-nums">{code}</span>
      </TapHint>
    </span>
  );
}

/** The pictograms of one chemical as a list (or a plain "none" note). */
export function PictogramList({
  codes,
  size = 'sm',
}: {
  codes: readonly GhsCode[];
  size?: 'sm' | 'lg';
}) {
  if (codes.length === 0) {
    return <span className="text-sm text-ink-600">No pictograms recorded</span>;
  }
  return (
    <ul
      aria-label="GHS pictograms"
      className={
        size === 'lg' ? 'grid gap-2 sm:grid-cols-2 xl:grid-cols-3' : 'flex flex-wrap gap-1'
      }
    >
      {codes.map((code) => (
        <li key={code}>
          <PictogramBadge code={code} size={size} />
        </li>
      ))}
    </ul>
  );
}
