import { useEffect, useId, useState } from 'react';
import { countOf, type RunTimeline } from '@lotwise/shared';
import { formatDateTime } from '../../../lib/format';
import { chartBoxFor, chartGeometry, type ChartGeometry, type WindowBand } from '../chart-geometry';
import { clockTime, formatC } from '../labels';

/** The mark of a reading outside its window: a triangle, not only another colour. */
function OutsideMark({ x, y, size = 7 }: { x: number; y: number; size?: number }) {
  return (
    <path
      d={`M${x},${y - size} L${x + size},${y + size * 0.8} L${x - size},${y + size * 0.8} Z`}
      fill="var(--color-danger-600)"
      stroke="var(--color-white)"
      strokeWidth={1}
    />
  );
}

function InsideMark({ x, y }: { x: number; y: number }) {
  return (
    <circle
      cx={x}
      cy={y}
      r={4.5}
      fill="var(--color-ink-800)"
      stroke="var(--color-white)"
      strokeWidth={1}
    />
  );
}

/** The width an element is shown at, followed as it changes; null until measured. */
function useWidth() {
  const [element, setElement] = useState<HTMLElement | null>(null);
  const [value, setValue] = useState<number | null>(null);
  useEffect(() => {
    if (!element || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(([entry]) => {
      const measured = entry?.contentRect.width;
      if (!measured) return;
      setValue((old) => (old !== null && Math.abs(old - measured) < 8 ? old : measured));
    });
    observer.observe(element);
    return () => observer.disconnect();
  }, [element]);
  return [setElement, value] as const;
}

/**
 * The words inside a band where they fit (about 6 px a character at 11 px): "Step 2: 5–7 °C",
 * else "Step 2", else none (the key and the readings table name the windows).
 */
function bandLabel(band: WindowBand): string | null {
  const fits = (text: string) => band.width > text.length * 6 + 8;
  const short = `Step ${band.stepIndex + 1}`;
  if (fits(band.label)) return band.label;
  return fits(short) ? short : null;
}

/** What the chart shows, in words: the text alternative and the figure's caption. */
export function chartSummary(chart: ChartGeometry): string {
  const outside = chart.points.filter((point) => point.outside).length;
  const parts = [
    chart.range
      ? `${countOf(chart.points.length, 'reading')} between ${formatC(chart.range.low)} and ${formatC(chart.range.high)}, taken from ${formatDateTime(chart.range.firstAt)} to ${clockTime(chart.range.lastAt)}`
      : 'No readings yet',
    `${countOf(chart.bands.length, 'step window')} shaded over the time the step was under way`,
    outside === 0
      ? 'every reading inside its window'
      : `${countOf(outside, 'reading')} outside its window, marked with a triangle`,
  ];
  return `${parts.join('; ')}.`;
}

/**
 * Temperature against time: each step's window shaded over the time it was under way,
 * readings as dots, a reading outside its window as a labelled triangle. SVG, so it prints
 * sharp; the caption and the readings table say the same in words.
 */
export function TemperatureChart({
  timeline,
  now,
}: {
  timeline: Pick<RunTimeline, 'status' | 'steps' | 'entries'>;
  now?: string;
}) {
  const titleId = useId();
  const [measure, measuredWidth] = useWidth();
  const chart = chartGeometry(timeline, { now, box: chartBoxFor(measuredWidth) });
  if (!chart) {
    return <p className="text-sm text-ink-600">No temperature was read during this run.</p>;
  }
  const { box, plot } = chart;
  const summary = chartSummary(chart);
  return (
    <figure
      ref={measure}
      className="flex max-w-3xl flex-col gap-2 break-inside-avoid"
      data-testid="temperature-chart"
    >
      <svg
        viewBox={`0 0 ${box.width} ${box.height}`}
        className="h-auto w-full overflow-visible font-sans"
        role="img"
        aria-labelledby={titleId}
      >
        <title id={titleId}>{`Temperature during the run: ${summary}`}</title>
        {chart.yTicks.map((tick) => (
          <g key={`y-${tick.label}`}>
            <line
              x1={plot.left}
              x2={plot.right}
              y1={tick.position}
              y2={tick.position}
              stroke="var(--color-ink-200)"
            />
            <text
              x={plot.left - 8}
              y={tick.position}
              textAnchor="end"
              dominantBaseline="middle"
              fontSize={12}
              fill="var(--color-ink-700)"
            >
              {tick.label}
            </text>
          </g>
        ))}
        {chart.bands.map((band) => (
          <g key={`band-${band.stepIndex}`} data-testid="window-band">
            <rect
              x={band.x}
              y={band.y}
              width={Math.max(band.width, 1)}
              height={band.height}
              fill="var(--color-ok-200)"
              fillOpacity={0.55}
              stroke="var(--color-ok-700)"
              strokeDasharray="4 3"
              strokeWidth={1}
            />
            {bandLabel(band) && (
              <text
                x={band.x + 4}
                y={band.y + 13}
                fontSize={11}
                fill="var(--color-ok-700)"
                fontWeight={600}
              >
                {bandLabel(band)}
              </text>
            )}
          </g>
        ))}
        <line
          x1={plot.left}
          x2={plot.right}
          y1={plot.bottom}
          y2={plot.bottom}
          stroke="var(--color-ink-500)"
        />
        <line
          x1={plot.left}
          x2={plot.left}
          y1={plot.top}
          y2={plot.bottom}
          stroke="var(--color-ink-500)"
        />
        {chart.xTicks.map((tick) => (
          <g key={`x-${tick.position}`}>
            <line
              x1={tick.position}
              x2={tick.position}
              y1={plot.bottom}
              y2={plot.bottom + 5}
              stroke="var(--color-ink-500)"
            />
            <text
              x={tick.position}
              y={plot.bottom + 18}
              textAnchor="middle"
              fontSize={12}
              fill="var(--color-ink-700)"
            >
              {tick.label}
            </text>
          </g>
        ))}
        <text
          x={(plot.left + plot.right) / 2}
          y={box.height - 6}
          textAnchor="middle"
          fontSize={12}
          fill="var(--color-ink-800)"
        >
          Time (clock time)
        </text>
        <text
          transform={`translate(14 ${(plot.top + plot.bottom) / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={12}
          fill="var(--color-ink-800)"
        >
          Temperature (°C)
        </text>
        {chart.line && (
          <path d={chart.line} fill="none" stroke="var(--color-ink-500)" strokeWidth={1.5} />
        )}
        {chart.points.map((point) =>
          point.outside ? (
            <g key={point.entryId} data-testid="reading-outside">
              <OutsideMark x={point.x} y={point.y} />
              <text
                x={point.x + 10}
                y={point.y - 6}
                fontSize={11}
                fontWeight={600}
                fill="var(--color-danger-700)"
              >
                {`${formatC(point.temperatureC)} outside`}
              </text>
            </g>
          ) : (
            <g key={point.entryId} data-testid="reading-inside">
              <InsideMark x={point.x} y={point.y} />
            </g>
          ),
        )}
      </svg>
      <ul
        aria-label="Key to the chart"
        className="flex flex-wrap gap-x-5 gap-y-1 text-xs text-ink-700"
      >
        <li className="flex items-center gap-1.5">
          <svg aria-hidden="true" viewBox="0 0 12 12" className="size-3">
            <circle cx={6} cy={6} r={4.5} fill="var(--color-ink-800)" />
          </svg>
          reading inside its window
        </li>
        <li className="flex items-center gap-1.5">
          <svg aria-hidden="true" viewBox="0 0 16 16" className="size-3.5">
            <OutsideMark x={8} y={8} size={6.5} />
          </svg>
          reading outside its window
        </li>
        <li className="flex items-center gap-1.5">
          <svg aria-hidden="true" viewBox="0 0 16 10" className="h-2.5 w-4">
            <rect
              width={16}
              height={10}
              fill="var(--color-ok-200)"
              stroke="var(--color-ok-700)"
              strokeDasharray="3 2"
            />
          </svg>
          a step’s window, while the step was under way
        </li>
      </ul>
      <figcaption className="text-sm text-ink-700">{summary}</figcaption>
      <details className="text-sm print:hidden">
        <summary className="cursor-pointer text-accent-700">The readings as a table</summary>
        <table className="mt-2 text-sm tabular-nums">
          <caption className="sr-only">Temperature readings</caption>
          <thead className="text-left text-xs text-ink-600 uppercase">
            <tr>
              <th className="py-1 pr-4 font-medium">Time</th>
              <th className="py-1 pr-4 font-medium">Step</th>
              <th className="py-1 pr-4 text-right font-medium">Temperature</th>
              <th className="py-1 font-medium">Window</th>
            </tr>
          </thead>
          <tbody>
            {chart.points.map((point) => {
              const step = point.stepIndex === null ? undefined : timeline.steps[point.stepIndex];
              return (
                <tr key={point.entryId} className="border-t border-ink-100">
                  <td className="py-1 pr-4">{clockTime(point.at)}</td>
                  <td className="py-1 pr-4">
                    {point.stepIndex === null ? '—' : `Step ${point.stepIndex + 1}`}
                  </td>
                  <td className="py-1 pr-4 text-right">{formatC(point.temperatureC)}</td>
                  <td className="py-1">
                    {step?.windowText ?? 'no window'}
                    {point.outside && (
                      <strong className="ml-2 text-danger-700">outside the window</strong>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
