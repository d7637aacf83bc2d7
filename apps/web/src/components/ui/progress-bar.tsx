import { cn } from '../../lib/cn';

/**
 * A labelled progress bar. Without `max` (or with max 0) it shows work under way of unknown
 * size. The text under it says the same in words.
 */
export function ProgressBar({
  label,
  value,
  max,
  detail,
  className,
}: {
  label: string;
  value: number;
  max: number;
  /** Words under the bar, e.g. "1,200 of 10,000 rows checked". */
  detail?: string;
  className?: string;
}) {
  const known = max > 0;
  const percent = known ? Math.min(100, Math.max(0, (value / max) * 100)) : 0;
  return (
    <div className={cn('flex flex-col gap-1', className)}>
      <div className="flex items-baseline justify-between gap-3 text-sm">
        <span className="font-medium text-ink-800">{label}</span>
        {known && <span className="text-ink-600 tabular-nums">{Math.floor(percent)} %</span>}
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={known ? max : undefined}
        aria-valuenow={known ? value : undefined}
        aria-valuetext={detail}
        className="h-2.5 overflow-hidden rounded-full border border-ink-200 bg-ink-100"
      >
        <div
          className={cn(
            'h-full rounded-full bg-accent-600 transition-[width] duration-300',
            !known && 'w-1/3 animate-pulse',
          )}
          style={known ? { width: `${percent}%` } : undefined}
        />
      </div>
      {detail && (
        <p className="text-sm text-ink-700 tabular-nums" aria-live="polite">
          {detail}
        </p>
      )}
    </div>
  );
}
