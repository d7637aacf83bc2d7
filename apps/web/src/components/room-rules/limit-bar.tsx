import { CircleAlert, CircleCheck, TriangleAlert } from 'lucide-react';
import { labAreaStatusLabels, type LabAreaStatus } from '@lotwise/shared';
import { cn } from '../../lib/cn';
import { formatFixed } from '../../lib/format';

const statusStyle: Record<LabAreaStatus, { bar: string; text: string; icon: typeof CircleCheck }> =
  {
    within: { bar: 'bg-ok-700', text: 'text-ok-700', icon: CircleCheck },
    near: { bar: 'bg-warn-700', text: 'text-warn-700', icon: TriangleAlert },
    over: { bar: 'bg-danger-600', text: 'text-danger-700', icon: CircleAlert },
  };

/** The status of a limit or an area in an icon and words (never colour alone). */
export function LimitStatus({ status }: { status: LabAreaStatus }) {
  const style = statusStyle[status];
  const Icon = style.icon;
  return (
    <span className={cn('inline-flex items-center gap-1 text-sm font-medium', style.text)}>
      <Icon aria-hidden="true" className="size-4" />
      {labAreaStatusLabels[status]}
    </span>
  );
}

/**
 * The share of a limit used as a bar with the number and the status in words. `fraction` null:
 * the limit is 0 (anything held is over it).
 */
export function LimitBar({
  label,
  fraction,
  status,
  detail,
  className,
}: {
  label: string;
  fraction: number | null;
  status: LabAreaStatus;
  /** Words beside the share, e.g. "12.0 L of 15.1 L". */
  detail?: string;
  className?: string;
}) {
  const style = statusStyle[status];
  const percent = fraction === null ? 100 : Math.min(100, Math.max(0, fraction * 100));
  const shareText = fraction === null ? 'limit is 0' : `${formatFixed(fraction * 100, 0)} % used`;
  return (
    <div className={cn('flex min-w-40 flex-col gap-1', className)}>
      <div
        role="meter"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={Math.round(percent)}
        aria-valuetext={`${shareText}, ${labAreaStatusLabels[status].toLowerCase()}`}
        className="h-2.5 overflow-hidden rounded-full border border-ink-200 bg-ink-100"
      >
        <div className={cn('h-full rounded-full', style.bar)} style={{ width: `${percent}%` }} />
      </div>
      <p className="flex flex-wrap items-center gap-x-2 text-sm text-ink-800 tabular-nums">
        <span className="font-semibold">{shareText}</span>
        {detail && <span className="text-ink-600">{detail}</span>}
        <LimitStatus status={status} />
      </p>
    </div>
  );
}
