import { TriangleAlert } from 'lucide-react';
import { formatPercent } from '../../../lib/format';

/** A percent yield, with words and an icon when it is above 100 %. */
export function YieldText({ percent }: { percent: number | null }) {
  if (percent === null) return <span className="text-ink-500">—</span>;
  if (percent <= 100)
    return <span className="whitespace-nowrap tabular-nums">{formatPercent(percent)}</span>;
  return (
    <span className="inline-flex items-center gap-1 whitespace-nowrap text-danger-700 tabular-nums">
      <TriangleAlert aria-hidden="true" className="size-3.5" />
      {formatPercent(percent)}
      <span className="text-xs">(above 100 %)</span>
    </span>
  );
}
