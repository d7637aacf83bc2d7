import { Link, useParams } from 'react-router';
import { ChevronLeft, Printer } from 'lucide-react';
import type { InspectionSummary } from '@lotwise/shared';
import {
  floorAreaUnitLabels,
  labAreaKindLabels,
} from '../../../components/room-rules/lab-unit-classes';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatDateTime, formatFixed } from '../../../lib/format';
import { useInspectionSummary } from '../api';
import {
  ConflictsSection,
  FlammableSection,
  WasteSection,
  WatchedSection,
} from '../components/inspection-sections';

/** Paper: one A4 or Letter sheet where it fits, small type, colours kept, no orphan headings. */
const printCss = `
@media print {
  @page { margin: 10mm; }
  .inspection-page { font-size: 8.5pt; gap: 0.6rem; -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  .inspection-page :is(p, ul, li, table, td, th, div, span, caption) { font-size: inherit; line-height: 1.3; }
  .inspection-page h1 { font-size: 14pt; }
  .inspection-page h2 { font-size: 10.5pt; break-after: avoid; }
  .inspection-page tr, .inspection-page li { break-inside: avoid; }
}
`;

function Summary({ summary }: { summary: InspectionSummary }) {
  const { area } = summary;
  const facts = [
    labAreaKindLabels[area.kind],
    `Class ${area.unitClass}`,
    `${formatFixed(area.floorArea, 1)} ${floorAreaUnitLabels[area.floorAreaUnit]}`,
    `storey ${area.storey}`,
    area.instructional ? 'instructional' : null,
  ]
    .filter(Boolean)
    .join(', ');
  return (
    <article className="inspection-page flex flex-col gap-4" aria-label="Inspection summary">
      <style>{printCss}</style>
      <header className="flex flex-col gap-0.5">
        <p className="text-xs tracking-wide text-ink-600 uppercase">Inspection summary</p>
        <h1 className="text-xl font-semibold text-ink-900">{area.path}</h1>
        <p className="text-sm text-ink-700">
          {facts}. For {formatDate(summary.date)}; made {formatDateTime(summary.generatedAt)}.
        </p>
      </header>
      <Notice tone="warn" title="A reminder, not an approval">
        {summary.reminder}
      </Notice>
      <FlammableSection flammable={summary.flammable} />
      <WatchedSection watched={summary.watched} />
      <WasteSection waste={summary.waste} />
      <ConflictsSection conflicts={summary.storageConflicts} />
      <footer className="border-t border-ink-300 pt-1 text-xs text-ink-600">
        Lotwise — {area.path} — {formatDate(summary.date)}. {summary.reminder}
      </footer>
    </article>
  );
}

/** `/stock/lab-areas/:id/inspection`: the printable one-page summary of a lab area. */
export function InspectionSummaryPage() {
  const params = useParams();
  const id = Number(params.id);
  const summary = useInspectionSummary(id);

  const back = (
    <Link
      to={paths.stockLabArea(id)}
      className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
    >
      <ChevronLeft aria-hidden="true" className="size-4" />
      The lab area
    </Link>
  );

  if (summary.isPending) return <PageSpinner label="Putting the summary together…" />;
  if (summary.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        {isApiError(summary.error) && summary.error.status === 404 ? (
          <Notice tone="warn" title="No such lab area">
            There is no lab area with the number {params.id} — it may have been unmarked.
          </Notice>
        ) : (
          <ErrorState
            title="The summary could not be made"
            error={summary.error}
            onRetry={() => void summary.refetch()}
          />
        )}
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-2 print:hidden">
        {back}
        <Button
          variant="primary"
          onClick={() => window.print()}
          icon={<Printer aria-hidden="true" className="size-4" />}
        >
          Print
        </Button>
      </div>
      <Summary summary={summary.data} />
    </div>
  );
}
