import { describe, expect, it } from 'vitest';
import type { Measurement } from './measure';
import { dropOf, markdownTable, replaceMarked, reportRows, type ExtraFigures } from './report';

const figures = (p50: number, rps: number): Measurement => ({
  p50,
  p975: p50 * 2,
  p99: p50 * 3,
  rps,
  requests: rps * 10,
  non2xx: 0,
  errors: 0,
  statuses: {},
});
const extra: ExtraFigures = {
  readsWhileWrites: {
    aloneRps: 400,
    withWritesRps: 340,
    baselineAloneRps: 900,
    baselineWithWritesRps: 880,
  },
  import: { rows: 10_000, commitMs: 6_000, checkMs: 2_000 },
  web: {
    signInJsBytes: 140 * 1024,
    signInCssBytes: 8 * 1024,
    chemicalsListJsBytes: 210 * 1024,
    chemicalsListCssBytes: 8 * 1024,
  },
  coldStartMs: 900,
};

describe('reportRows', () => {
  it('when a read is 1.4x the baseline at 70 % of its throughput, then it is met; at 1.6x it is missed', () => {
    const rows = reportRows(
      [
        { id: 'a', title: 'list', kind: 'read', api: figures(14, 70), baseline: figures(10, 100) },
        {
          id: 'b',
          title: 'overview',
          kind: 'read',
          api: figures(16, 70),
          baseline: figures(10, 100),
        },
      ],
      extra,
    );
    expect(rows[0]).toMatchObject({ latencyRatio: 1.4, met: true });
    expect(rows[1]).toMatchObject({ latencyRatio: 1.6, met: false });
  });

  it('when a write is 1.9x the baseline but reaches only half its throughput, then it is missed', () => {
    const [row] = reportRows(
      [{ id: 'd', title: 'draw', kind: 'write', api: figures(19, 50), baseline: figures(10, 100) }],
      extra,
    );
    expect(row).toMatchObject({ latencyRatio: 1.9, throughputShare: 0.5, met: false });
  });

  it('when reads lose 15 % beside writes and the import takes 6 s, then the first is met and the second missed', () => {
    const rows = reportRows([], extra);
    expect(dropOf(400, 340)).toBeCloseTo(0.15);
    expect(rows.map((row) => row.met)).toEqual([true, false, true, false, true]);
    const table = markdownTable(rows);
    expect(table).toContain('15 % (400 → 340 req/s; baseline 2 %)');
    expect(table.split('\n')).toHaveLength(2 + rows.length);
  });
});

describe('replaceMarked', () => {
  it('when the markers are there, then only what stands between them is replaced', () => {
    const doc = 'intro\n<!-- bench:latest:start -->\nold\n<!-- bench:latest:end -->\noutro\n';
    expect(replaceMarked(doc, 'latest', 'new table')).toBe(
      'intro\n<!-- bench:latest:start -->\nnew table\n<!-- bench:latest:end -->\noutro\n',
    );
  });

  it('when the markers are missing, then the marked section is added at the end', () => {
    expect(replaceMarked('intro\n', 'before', 'figures')).toBe(
      'intro\n\n<!-- bench:before:start -->\nfigures\n<!-- bench:before:end -->\n',
    );
  });
});
