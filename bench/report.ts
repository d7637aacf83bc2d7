import type { Measurement } from './measure';
import type { QuestionKind } from './questions';

/** The targets every figure is held to. */
export const targets = {
  readLatencyRatio: 1.5,
  writeLatencyRatio: 2,
  throughputShare: 0.6,
  readsWhileWritesDrop: 0.2,
  importMs: 5_000,
  signInJsBytes: 150 * 1024,
  chemicalsListJsBytes: 200 * 1024,
  coldStartMs: 1_500,
} as const;

export interface QuestionResult {
  id: string;
  title: string;
  kind: QuestionKind;
  api: Measurement;
  baseline: Measurement;
}

/** A line of the table: a figure beside its target, met or missed. */
export interface ReportRow {
  question: string;
  apiP50: number | null;
  apiP975: number | null;
  apiRps: number | null;
  baselineP50: number | null;
  baselineP975: number | null;
  baselineRps: number | null;
  /** API p50 / baseline p50. */
  latencyRatio: number | null;
  /** API req/s / baseline req/s. */
  throughputShare: number | null;
  /** The figure when it is not a latency (a drop, a time, a size), already written out. */
  value: string | null;
  target: string;
  met: boolean;
}

export interface ExtraFigures {
  readsWhileWrites: {
    aloneRps: number;
    withWritesRps: number;
    baselineAloneRps: number;
    baselineWithWritesRps: number;
  };
  import: { rows: number; commitMs: number; checkMs: number };
  web: {
    signInJsBytes: number;
    signInCssBytes: number;
    chemicalsListJsBytes: number;
    chemicalsListCssBytes: number;
  };
  coldStartMs: number;
}

const kB = (bytes: number) => `${(bytes / 1024).toFixed(1)} kB`;
const ms = (value: number) => `${value.toFixed(value < 10 ? 1 : 0)} ms`;
const percent = (share: number) => `${(share * 100).toFixed(0)} %`;

/** Share of throughput lost when writes run beside the reads (0.25 = a quarter fewer). */
export function dropOf(alone: number, withWrites: number): number {
  return alone > 0 ? Math.max(0, 1 - withWrites / alone) : 0;
}

/** Every question and figure as table rows, each with its target and whether it is met. */
export function reportRows(questions: QuestionResult[], extra: ExtraFigures): ReportRow[] {
  const rows: ReportRow[] = questions.map((q) => {
    const limit = q.kind === 'write' ? targets.writeLatencyRatio : targets.readLatencyRatio;
    const latencyRatio = q.baseline.p50 > 0 ? q.api.p50 / q.baseline.p50 : null;
    const throughputShare = q.baseline.rps > 0 ? q.api.rps / q.baseline.rps : null;
    return {
      question: q.title,
      apiP50: q.api.p50,
      apiP975: q.api.p975,
      apiRps: q.api.rps,
      baselineP50: q.baseline.p50,
      baselineP975: q.baseline.p975,
      baselineRps: q.baseline.rps,
      latencyRatio,
      throughputShare,
      value: null,
      target: `ratio ≤ ${limit}, share ≥ ${percent(targets.throughputShare)}`,
      met:
        latencyRatio !== null &&
        throughputShare !== null &&
        latencyRatio <= limit &&
        throughputShare >= targets.throughputShare,
    };
  });
  const figure = (question: string, value: string, target: string, met: boolean): ReportRow => ({
    question,
    apiP50: null,
    apiP975: null,
    apiRps: null,
    baselineP50: null,
    baselineP975: null,
    baselineRps: null,
    latencyRatio: null,
    throughputShare: null,
    value,
    target,
    met,
  });
  const rww = extra.readsWhileWrites;
  const drop = dropOf(rww.aloneRps, rww.withWritesRps);
  const baselineDrop = dropOf(rww.baselineAloneRps, rww.baselineWithWritesRps);
  rows.push(
    figure(
      'reads while writes run: search throughput lost while 2 connections draw',
      `${percent(drop)} (${rww.aloneRps.toFixed(0)} → ${rww.withWritesRps.toFixed(0)} req/s; baseline ${percent(baselineDrop)})`,
      `≤ ${percent(targets.readsWhileWritesDrop)}`,
      drop <= targets.readsWhileWritesDrop,
    ),
    figure(
      `${extra.import.rows.toLocaleString('en')}-row CSV stock import, commit`,
      `${ms(extra.import.commitMs)} (check ${ms(extra.import.checkMs)})`,
      `< ${ms(targets.importMs)}`,
      extra.import.commitMs < targets.importMs,
    ),
    figure(
      'first page (sign-in): JS gzip',
      `${kB(extra.web.signInJsBytes)} (+ CSS ${kB(extra.web.signInCssBytes)})`,
      `≤ ${kB(targets.signInJsBytes)}`,
      extra.web.signInJsBytes <= targets.signInJsBytes,
    ),
    figure(
      'chemicals list: JS gzip',
      `${kB(extra.web.chemicalsListJsBytes)} (+ CSS ${kB(extra.web.chemicalsListCssBytes)})`,
      `≤ ${kB(targets.chemicalsListJsBytes)}`,
      extra.web.chemicalsListJsBytes <= targets.chemicalsListJsBytes,
    ),
    figure(
      'cold start (spawn → GET /api/health answers, restart)',
      ms(extra.coldStartMs),
      `< ${ms(targets.coldStartMs)}`,
      extra.coldStartMs < targets.coldStartMs,
    ),
  );
  return rows;
}

const cellOf = (value: number | null, write: (n: number) => string) =>
  value === null ? '' : write(value);

/** The rows as a Markdown table (also what the terminal prints). */
export function markdownTable(rows: ReportRow[]): string {
  const head = [
    'question',
    'API p50 / p97.5',
    'API req/s',
    'baseline p50 / p97.5',
    'baseline req/s',
    'latency ratio',
    'throughput share',
    'target',
    'met',
  ];
  const lines = [
    `| ${head.join(' | ')} |`,
    `| ${head.map((_, i) => (i === 0 || i === 7 ? '---' : '---:')).join(' | ')} |`,
  ];
  for (const row of rows) {
    const cells =
      row.value !== null
        ? [row.question, row.value, '', '', '', '', '', row.target]
        : [
            row.question,
            `${cellOf(row.apiP50, ms)} / ${cellOf(row.apiP975, ms)}`,
            cellOf(row.apiRps, (n) => n.toFixed(0)),
            `${cellOf(row.baselineP50, ms)} / ${cellOf(row.baselineP975, ms)}`,
            cellOf(row.baselineRps, (n) => n.toFixed(0)),
            cellOf(row.latencyRatio, (n) => `${n.toFixed(2)}x`),
            cellOf(row.throughputShare, percent),
            row.target,
          ];
    cells.push(row.met ? 'met' : '**missed**');
    lines.push(`| ${cells.map((cell) => cell.replace(/\|/g, '\\|')).join(' | ')} |`);
  }
  return lines.join('\n');
}

/** Replaces what stands between `<!-- bench:NAME:start -->` and `<!-- bench:NAME:end -->`. */
export function replaceMarked(document: string, name: string, content: string): string {
  const start = `<!-- bench:${name}:start -->`;
  const end = `<!-- bench:${name}:end -->`;
  const block = `${start}\n${content.trim()}\n${end}`;
  const from = document.indexOf(start);
  const to = document.indexOf(end);
  if (from === -1 || to === -1 || to < from) {
    return `${document.trimEnd()}\n\n${block}\n`;
  }
  return document.slice(0, from) + block + document.slice(to + end.length);
}
