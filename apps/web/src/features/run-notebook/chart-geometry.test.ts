import { describe, expect, it } from 'vitest';
import { chartGeometry, defaultChartBox } from './chart-geometry';
import { makeTimeline, makeTimelineEntry, makeTimelineStep } from './test-factories';

const now = '2026-12-03T09:40:00.000Z';
const utc = (date: Date) => date.toISOString().slice(11, 16);

describe('chartGeometry', () => {
  it('when steps with windows were under way, then each band spans exactly its step’s start to end', () => {
    const chart = chartGeometry(makeTimeline(), { now, timeLabel: utc })!;
    const { plot } = chart;
    // the chart runs 09:00 (first entry) to 09:30 (last entry): step 3, still under way,
    // has no window, so nothing stretches the chart to now (09:40)
    const at = (minutes: number) => plot.left + ((plot.right - plot.left) * minutes) / 30;

    expect(chart.bands.map((band) => band.stepIndex)).toEqual([0, 1]);
    const [cooling, addition] = chart.bands;
    expect(cooling!.x).toBeCloseTo(at(0));
    expect(cooling!.x + cooling!.width).toBeCloseTo(at(10));
    expect(addition!.x).toBeCloseTo(at(10));
    expect(addition!.x + addition!.width).toBeCloseTo(at(30));
    expect(addition!.label).toBe('Step 2: 5–7 °C');
    expect(addition!.open).toBe(false);
  });

  it('when a band’s window is 5–7 °C, then its top is at 7 °C and its bottom at 5 °C on the scale', () => {
    const chart = chartGeometry(makeTimeline(), { now })!;
    const addition = chart.bands.find((band) => band.stepIndex === 1)!;
    const reading6 = chart.points.find((point) => point.temperatureC === 6)!;
    const reading9 = chart.points.find((point) => point.temperatureC === 9)!;
    // linear scale: 6 °C sits halfway between the band's edges; 9 °C above its top
    expect(reading6.y).toBeCloseTo(addition.y + addition.height / 2);
    expect(reading9.y).toBeLessThan(addition.y);
  });

  it('when a reading is outside its step’s window, then only that point is flagged', () => {
    const chart = chartGeometry(makeTimeline(), { now })!;
    expect(chart.points.map((point) => [point.temperatureC, point.outside])).toEqual([
      [3, false],
      [6, false],
      [9, true],
    ]);
    expect(chart.range).toEqual({
      low: 3,
      high: 9,
      firstAt: '2026-12-03T09:05:00.000Z',
      lastAt: '2026-12-03T09:20:00.000Z',
    });
  });

  it('when the server has not flagged a reading, then the window rule of @lotwise/chem still marks it outside', () => {
    const timeline = makeTimeline();
    const unflagged = {
      ...timeline,
      entries: timeline.entries.map((entry) => ({ ...entry, deviation: null })),
    };
    const chart = chartGeometry(unflagged, { now })!;
    expect(chart.points.filter((point) => point.outside).map((p) => p.temperatureC)).toEqual([9]);
  });

  it('when a step with a window is still under way in an open run, then its band runs to now', () => {
    const timeline = makeTimeline({
      steps: [makeTimelineStep({ index: 0, startedAt: '2026-12-03T09:00:00.000Z', endedAt: null })],
      entries: [
        makeTimelineEntry({ kind: 'step-start', at: '2026-12-03T09:00:00.000Z', stepIndex: 0 }),
      ],
    });
    const chart = chartGeometry(timeline, { now })!;
    expect(chart.bands[0]!.open).toBe(true);
    expect(chart.bands[0]!.endAt).toBe(now);
    expect(chart.bands[0]!.x + chart.bands[0]!.width).toBeCloseTo(chart.plot.right);
  });

  it('when a window is open at one end, then the band reaches the edge of the scale', () => {
    const timeline = makeTimeline({
      steps: [
        makeTimelineStep({
          index: 0,
          temperatureLowC: null,
          temperatureHighC: 30,
          windowText: 'at most 30 °C',
          startedAt: '2026-12-03T09:00:00.000Z',
          endedAt: '2026-12-03T09:30:00.000Z',
        }),
      ],
      entries: [
        makeTimelineEntry({
          kind: 'reading',
          at: '2026-12-03T09:10:00.000Z',
          stepIndex: 0,
          temperatureC: 22,
        }),
      ],
      status: 'recorded',
    });
    const chart = chartGeometry(timeline, { now })!;
    const band = chart.bands[0]!;
    expect(band.y + band.height).toBeCloseTo(chart.plot.bottom);
    expect(band.label).toBe('Step 1: at most 30 °C');
    expect(chart.points[0]!.outside).toBe(false);
  });

  it('when the axes are drawn, then the ticks are clock times and whole degrees inside the plot', () => {
    const chart = chartGeometry(makeTimeline(), { now, timeLabel: utc })!;
    expect(chart.xTicks.map((tick) => tick.label)).toContain('09:10');
    for (const tick of chart.xTicks) {
      expect(tick.position).toBeGreaterThanOrEqual(defaultChartBox.margin.left);
      expect(tick.position).toBeLessThanOrEqual(chart.plot.right);
    }
    expect(chart.yTicks.length).toBeGreaterThan(2);
    expect(chart.line.startsWith('M')).toBe(true);
  });

  it('when nothing was read and no step had a window, then there is no chart', () => {
    const timeline = makeTimeline({
      steps: [makeTimelineStep({ temperatureLowC: null, temperatureHighC: null })],
      entries: [makeTimelineEntry({ kind: 'note', text: 'Started late' })],
    });
    expect(chartGeometry(timeline, { now })).toBeNull();
  });
});
