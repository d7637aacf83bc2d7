import {
  CartesianGrid,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { RunSummary } from '@lotwise/shared';
import { formatDate, formatPercent } from '../../../lib/format';

/**
 * Percent yield of each recorded run against the expected yield. Loaded on its own so the
 * charting library stays out of the first download; decorative for assistive tech (the
 * table next to it holds the same numbers).
 */
export default function YieldsChart({
  runs,
  expectedYieldPercent,
}: {
  runs: readonly RunSummary[];
  expectedYieldPercent: number | null;
}) {
  const data = runs
    .filter((run) => run.percentYield !== null)
    .map((run) => ({
      label: `#${run.id} ${formatDate(run.performedOn ?? run.createdAt)}`,
      yield: Math.round(run.percentYield! * 10) / 10,
    }));
  const top = Math.max(110, ...data.map((d) => Math.ceil(d.yield / 10) * 10 + 10));
  return (
    <div aria-hidden="true" className="h-64 w-full">
      <ResponsiveContainer width="100%" height="100%">
        {/* hidden from assistive tech, so no keyboard stop either: the table beside it has the data */}
        <LineChart
          data={data}
          margin={{ top: 12, right: 24, bottom: 0, left: 0 }}
          accessibilityLayer={false}
        >
          <CartesianGrid stroke="var(--color-ink-200)" vertical={false} />
          <XAxis dataKey="label" tick={{ fontSize: 12, fill: 'var(--color-ink-600)' }} />
          <YAxis
            domain={[0, top]}
            tickFormatter={(value: number) => `${value} %`}
            tick={{ fontSize: 12, fill: 'var(--color-ink-600)' }}
            width={56}
          />
          <Tooltip formatter={(value) => [formatPercent(Number(value)), 'Yield']} />
          {expectedYieldPercent !== null && (
            <ReferenceLine
              y={expectedYieldPercent}
              stroke="var(--color-ink-500)"
              strokeDasharray="6 4"
              label={{
                value: `expected ${expectedYieldPercent} %`,
                position: 'insideBottomRight',
                fontSize: 12,
                fill: 'var(--color-ink-700)',
              }}
            />
          )}
          <ReferenceLine
            y={100}
            stroke="var(--color-danger-600)"
            strokeDasharray="2 3"
            label={{
              value: '100 %',
              position: 'insideTopRight',
              fontSize: 12,
              fill: 'var(--color-danger-700)',
            }}
          />
          <Line
            type="linear"
            dataKey="yield"
            stroke="var(--color-accent-600)"
            strokeWidth={2}
            dot={{ r: 4, fill: 'var(--color-accent-600)' }}
            isAnimationActive={false}
          />
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
