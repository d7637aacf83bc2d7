/**
 * Where everything of the temperature chart goes: pure arithmetic on the run's timeline, so
 * the SVG only draws and the rules (what is outside a window) stay those of
 * `@lotwise/chem`. Scales and ticks come from d3-scale.
 */
import { scaleLinear, scaleTime } from 'd3-scale';
import { checkTemperatureWindow, currentStepAt, temperatureWindowText } from '@lotwise/chem';
import type { RunTimeline } from '@lotwise/shared';

export interface ChartBox {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
}

export const defaultChartBox: ChartBox = {
  width: 720,
  height: 300,
  margin: { top: 16, right: 20, bottom: 48, left: 60 },
};

/**
 * The chart's box for the width it is shown at, so its text keeps its size: a phone draws
 * fewer, larger units than a desk (the SVG then scales only a little).
 */
export function chartBoxFor(width: number | null): ChartBox {
  if (width === null) return defaultChartBox;
  const clamped = Math.min(Math.max(Math.round(width), 300), 900);
  return {
    width: clamped,
    height: clamped < 500 ? 240 : 300,
    margin: { top: 16, right: clamped < 500 ? 12 : 20, bottom: 48, left: clamped < 500 ? 48 : 60 },
  };
}

/** A step's window, shaded over the time the step was under way. */
export interface WindowBand {
  stepIndex: number;
  /** When the step started and ended (or the chart's end, while it is under way). */
  startAt: string;
  endAt: string;
  /** Still under way: the band stops at the latest time on the chart. */
  open: boolean;
  x: number;
  width: number;
  y: number;
  height: number;
  /** "Step 2: 5–7 °C". */
  label: string;
}

export interface ReadingPoint {
  entryId: number;
  at: string;
  temperatureC: number;
  stepIndex: number | null;
  x: number;
  y: number;
  /** Outside the window of its step (flagged by the server, or by the same rule here). */
  outside: boolean;
}

export interface Tick {
  position: number;
  label: string;
}

export interface ChartGeometry {
  box: ChartBox;
  plot: { left: number; top: number; right: number; bottom: number };
  startAt: string;
  endAt: string;
  bands: WindowBand[];
  points: ReadingPoint[];
  /** The readings joined in time order (an SVG path), empty below two readings. */
  line: string;
  xTicks: Tick[];
  yTicks: Tick[];
  /** Lowest and highest reading, °C, and when the first and last were taken; null without readings. */
  range: { low: number; high: number; firstAt: string; lastAt: string } | null;
}

const minute = 60_000;

/**
 * The chart of a timeline; null when there is nothing to draw (no reading and no step with
 * a window that was started). `now` ends the band of a step still under way in an open run.
 */
export function chartGeometry(
  timeline: Pick<RunTimeline, 'status' | 'steps' | 'entries'>,
  {
    box = defaultChartBox,
    now = new Date().toISOString(),
    timeLabel = hourMinute(),
  }: { box?: ChartBox; now?: string; timeLabel?: (date: Date) => string } = {},
): ChartGeometry | null {
  const readings = timeline.entries
    .filter((entry) => entry.kind === 'reading' && entry.temperatureC !== null)
    .sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
  const windowed = timeline.steps.filter(
    (step) =>
      step.startedAt !== null && (step.temperatureLowC !== null || step.temperatureHighC !== null),
  );
  if (readings.length === 0 && windowed.length === 0) return null;

  const times = [
    ...timeline.entries.map((entry) => Date.parse(entry.at)),
    ...timeline.steps.flatMap((step) =>
      [step.startedAt, step.endedAt].filter((at): at is string => at !== null).map(Date.parse),
    ),
  ];
  let start = Math.min(...times);
  let end = Math.max(...times);
  // a band still under way runs to now; a step without a window draws nothing to extend
  const underWay = windowed.some((step) => step.endedAt === null);
  if (timeline.status === 'open' && underWay) end = Math.max(end, Date.parse(now));
  if (end - start < 10 * minute) {
    const middle = (start + end) / 2;
    start = middle - 5 * minute;
    end = middle + 5 * minute;
  }

  const temperatures = [
    ...readings.map((entry) => entry.temperatureC!),
    ...windowed.flatMap((step) =>
      [step.temperatureLowC, step.temperatureHighC].filter((t): t is number => t !== null),
    ),
  ];
  const low = Math.min(...temperatures);
  const high = Math.max(...temperatures);
  const pad = Math.max(2, (high - low) * 0.1);

  const plot = {
    left: box.margin.left,
    top: box.margin.top,
    right: box.width - box.margin.right,
    bottom: box.height - box.margin.bottom,
  };
  const x = scaleTime()
    .domain([new Date(start), new Date(end)])
    .range([plot.left, plot.right]);
  const y = scaleLinear()
    .domain([low - pad, high + pad])
    .range([plot.bottom, plot.top])
    .nice();
  const [yMin, yMax] = y.domain() as [number, number];

  const bands: WindowBand[] = windowed.map((step) => {
    const stepEnd = step.endedAt ? Date.parse(step.endedAt) : end;
    const x0 = x(new Date(Date.parse(step.startedAt!)));
    const x1 = x(new Date(Math.max(stepEnd, Date.parse(step.startedAt!))));
    const top = y(step.temperatureHighC ?? yMax);
    const bottom = y(step.temperatureLowC ?? yMin);
    return {
      stepIndex: step.index,
      startAt: step.startedAt!,
      endAt: new Date(stepEnd).toISOString(),
      open: step.endedAt === null,
      x: x0,
      width: x1 - x0,
      y: top,
      height: bottom - top,
      label: `Step ${step.index + 1}: ${step.windowText ?? temperatureWindowText(step)}`,
    };
  });

  const points: ReadingPoint[] = readings.map((entry) => {
    const stepIndex = entry.stepIndex ?? currentStepAt(timeline.entries, entry.at);
    const step = stepIndex === null ? undefined : timeline.steps[stepIndex];
    const temperatureC = entry.temperatureC!;
    const outside =
      entry.deviation?.reason === 'reading-outside-window' ||
      (step !== undefined && !checkTemperatureWindow(temperatureC, step).inside);
    return {
      entryId: entry.id,
      at: entry.at,
      temperatureC,
      stepIndex,
      x: x(new Date(Date.parse(entry.at))),
      y: y(temperatureC),
      outside,
    };
  });

  const line =
    points.length < 2
      ? ''
      : points.map((p, i) => `${i === 0 ? 'M' : 'L'}${round(p.x)},${round(p.y)}`).join(' ');

  return {
    box,
    plot,
    startAt: new Date(start).toISOString(),
    endAt: new Date(end).toISOString(),
    bands,
    points,
    line,
    // about one clock time per 110 px, so labels like "05:30 AM" never touch
    xTicks: x
      .ticks(Math.max(3, Math.floor((plot.right - plot.left) / 110)))
      .map((date) => ({ position: x(date), label: timeLabel(date) })),
    yTicks: y
      .ticks(box.width < 500 ? 5 : 6)
      .map((value) => ({ position: y(value), label: String(value) })),
    range: readings.length
      ? {
          low: Math.min(...points.map((p) => p.temperatureC)),
          high: Math.max(...points.map((p) => p.temperatureC)),
          firstAt: readings[0]!.at,
          lastAt: readings[readings.length - 1]!.at,
        }
      : null,
  };
}

function round(value: number) {
  return Math.round(value * 10) / 10;
}

/** "09:15": the clock time in the reader's time zone. */
export function hourMinute(locale?: string) {
  const format = new Intl.DateTimeFormat(locale, { hour: '2-digit', minute: '2-digit' });
  return (date: Date) => format.format(date);
}
