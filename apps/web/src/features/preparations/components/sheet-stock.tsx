import { CircleCheck, CircleX, TriangleAlert } from 'lucide-react';
import type { DispensingSheet } from '@lotwise/shared';
import { formatAmount, formatPercent } from '../../../lib/format';

type SheetLine = DispensingSheet['lines'][number];

function benchRange(from: number, to: number): string {
  if (from > to) return '';
  return from === to ? `bench ${from}` : `benches ${from}–${to}`;
}

/** What to do about a short line: prepare it first when a procedure makes it, else reorder. */
export function RemedyText({ line }: { line: SheetLine }) {
  const { stock } = line;
  if (stock.remedy === 'prepare') {
    const prepare = stock.suggestions.find((s) => s.kind === 'prepare');
    if (prepare?.kind === 'prepare') {
      return (
        <>
          Prepare it first: {prepare.procedureTitle} at factor {prepare.roundedFactor} (about{' '}
          {formatAmount(prepare.expectedAmount, prepare.unit)} at its expected{' '}
          {formatPercent(prepare.expectedYieldPercent)} yield), or reorder.
        </>
      );
    }
  }
  return <>Reorder {formatAmount(stock.shortfall, stock.unit)} before the session.</>;
}

/**
 * A line's stock word on a sheet, from the plan's stock check: "In stock", or "Short by …"
 * with how many benches what is on hand serves and what to do.
 */
export function SheetStockNote({ line, benches }: { line: SheetLine; benches: number }) {
  const { stock } = line;
  if (stock.status === 'ok') {
    return (
      <span className="inline-flex items-center gap-1 text-xs text-ink-700">
        <CircleCheck aria-hidden="true" className="size-3.5" />
        In stock
      </span>
    );
  }
  if (stock.status === 'unconvertible') {
    return (
      <span className="flex items-start gap-1 text-xs font-semibold text-warn-700">
        <TriangleAlert aria-hidden="true" className="mt-0.5 size-3.5 shrink-0" />
        <span>Not checked: {stock.problem}</span>
      </span>
    );
  }
  return (
    <span
      className="flex items-start gap-1 text-xs text-danger-700"
      data-testid={`sheet-short-${line.lineIndex}-${line.purpose}`}
    >
      <TriangleAlert aria-hidden="true" className="mt-0.5 size-3.5 shrink-0" />
      <span>
        <strong className="uppercase">Short</strong> by{' '}
        <strong className="tabular-nums">{formatAmount(stock.shortfall, stock.unit)}</strong> for
        the session
        {stock.benchesCovered !== null &&
          ` — on hand serves ${stock.benchesCovered} of ${benches} ${benches === 1 ? 'bench' : 'benches'}`}
        {line.optional ? ' (optional line).' : '.'} <RemedyText line={line} />
      </span>
    </span>
  );
}

/** Lines that stop `bench` being served (required lines covering fewer benches). */
function blockingLines(sheet: DispensingSheet, bench: number): SheetLine[] {
  return sheet.lines.filter(
    (line) => !line.optional && line.role !== 'product' && (line.stock.benchesCovered ?? 0) < bench,
  );
}

/** The session in one sentence: which benches what is on hand serves, which it does not. */
export function SessionStockSummary({ sheet }: { sheet: DispensingSheet }) {
  const served = sheet.benchesServed;
  if (sheet.shortCount === 0) {
    return (
      <p className="flex items-center gap-1.5 rounded-md border border-ink-300 px-3 py-2 text-sm">
        <CircleCheck aria-hidden="true" className="size-4 text-ok-700" />
        In stock for all {sheet.benches} {sheet.benches === 1 ? 'bench' : 'benches'}.
      </p>
    );
  }
  return (
    <div
      role="note"
      className="flex items-start gap-1.5 rounded-md border-2 border-danger-700 px-3 py-2 text-sm"
    >
      <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-danger-700" />
      <p>
        <strong>
          Short: {sheet.shortCount} {sheet.shortCount === 1 ? 'line' : 'lines'}.
        </strong>{' '}
        {served > 0
          ? `${capitalise(benchRange(1, served))} can be served from what is on hand; `
          : 'No bench can be served from what is on hand; '}
        {served < sheet.benches
          ? `${benchRange(served + 1, sheet.benches)} cannot.`
          : 'every bench can.'}{' '}
        See the lines marked short for what to do.
      </p>
    </div>
  );
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** On a bench page: can this bench be served from what is on hand, and if not, why. */
export function BenchStockStatus({ sheet, bench }: { sheet: DispensingSheet; bench: number }) {
  const blocking = blockingLines(sheet, bench);
  if (blocking.length > 0) {
    return (
      <div
        role="note"
        data-testid={`bench-status-${bench}`}
        className="flex items-start gap-1.5 rounded-md border-2 border-danger-700 px-3 py-2 text-sm"
      >
        <CircleX aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-danger-700" />
        <p>
          <strong>Bench {bench} cannot be served from what is on hand</strong>: short of{' '}
          {blocking.map((line) => line.name).join(', ')}. Prepare or reorder before the session (see
          below).
        </p>
      </div>
    );
  }
  return (
    <p
      data-testid={`bench-status-${bench}`}
      className="flex items-start gap-1.5 rounded-md border border-ink-300 px-3 py-2 text-sm"
    >
      <CircleCheck aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-ok-700" />
      <span>
        Bench {bench} can be served from what is on hand
        {sheet.shortCount > 0 ? '; the session is short on other benches (see below).' : '.'}
      </span>
    </p>
  );
}
