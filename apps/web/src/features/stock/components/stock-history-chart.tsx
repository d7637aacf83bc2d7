import {
  Area,
  AreaChart,
  CartesianGrid,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { StockHistory } from '@lotwise/shared';
import { formatAmount, formatDate } from '../../../lib/format';

/**
 * The chart itself; loaded on its own so the charting library stays out of the first
 * download. Decorative for assistive tech: the caption, summary and table say the same.
 */
export default function StockHistoryChart({ history }: { history: StockHistory }) {
  // A time axis, so a quiet month takes as much room as a busy one.
  const data = history.points.map((point) => ({ ...point, time: Date.parse(point.date) }));
  return (
    <div aria-hidden="true" className="h-64 w-full">
      <ResponsiveContainer width="100%" height="100%">
        {/* hidden from assistive tech, so no keyboard stop either: the table beside it has the data */}
        <AreaChart
          data={data}
          margin={{ top: 8, right: 16, bottom: 0, left: 8 }}
          accessibilityLayer={false}
        >
          <CartesianGrid stroke="var(--color-ink-200)" vertical={false} />
          <XAxis
            dataKey="time"
            type="number"
            scale="time"
            domain={['dataMin', 'dataMax']}
            tickFormatter={(time: number) => formatDate(new Date(time))}
            tick={{ fontSize: 12, fill: 'var(--color-ink-600)' }}
            minTickGap={40}
          />
          <YAxis
            tickFormatter={(value: number) => formatAmount(value, history.unit)}
            tick={{ fontSize: 12, fill: 'var(--color-ink-600)' }}
            width={80}
          />
          <Tooltip
            formatter={(value) => [formatAmount(Number(value), history.unit), 'Held']}
            labelFormatter={(time) => formatDate(new Date(Number(time)))}
          />
          <Area
            type="stepAfter"
            dataKey="total"
            stroke="var(--color-accent-600)"
            fill="var(--color-accent-100)"
            strokeWidth={2}
            isAnimationActive={false}
          />
        </AreaChart>
      </ResponsiveContainer>
    </div>
  );
}
