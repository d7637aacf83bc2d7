import { useEffect, useRef, type ReactNode } from 'react';
import { Link, Navigate, useLocation, useParams } from 'react-router';
import { ChevronLeft, Lock, Printer, Scale } from 'lucide-react';
import type { ContainerDetail } from '@lotwise/shared';
import { Formula } from '../../../components/chem/formula';
import { freeOf, HoldList } from '../../../components/holds/container-holds';
import { Button, buttonClasses } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { isApiError, withQuery } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import { formatAmount, formatDate, formatPercent } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useContainer, useContainerByLabel } from '../api';
import { ContainerMaterialField } from '../components/container-material';
import { ContainerActions } from '../components/container-actions';
import { ContainerHazards } from '../components/container-hazards';
import { lotSummary } from '../components/containers-table';
import { DrawForm } from '../components/draw-form';
import { LotCertificateSection } from '../components/lot-certificate';
import { LedgerTable } from '../components/ledger-table';
import { SegregationWarnings } from '../components/segregation-warnings';
import { ContainerStatusBadge, ExpiryText, PeroxideDueText } from '../labels';

function Property({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 border-b border-ink-100 py-1.5 last:border-b-0 sm:flex-row sm:gap-4">
      <dt className="w-36 shrink-0 text-sm text-ink-600">{term}</dt>
      <dd className="text-sm text-ink-900">{children}</dd>
    </div>
  );
}

const back = (
  <Link
    to={paths.stockContainers}
    className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
  >
    <ChevronLeft aria-hidden="true" className="size-4" />
    All containers
  </Link>
);

/**
 * At the shelf the draw form sits below the hazards and the container's facts: this brings it
 * up and puts the cursor in its first field.
 */
function goToDrawForm() {
  const section = document.getElementById('draw');
  // (not every browser engine scrolls elements; test DOMs do not)
  section?.scrollIntoView?.({ block: 'start' });
  section
    ?.querySelector<HTMLInputElement>('input:not([type="radio"])')
    ?.focus({ preventScroll: true });
}

function ContainerView({ container: c }: { container: ContainerDetail }) {
  const mayDraw = useCan('stock.draw');
  const mayWrite = useCan('stock.write');
  const usable = c.status === 'sealed' || c.status === 'open';
  const drawRef = useRef<HTMLElement>(null);
  const { hash } = useLocation();
  // A scanned label opens the container at `#draw`: the draw form in view, the amount focused.
  useEffect(() => {
    if (hash !== '#draw') return;
    // Focusing brings the field into view (the section's scroll margin keeps the bar off it).
    drawRef.current?.querySelector<HTMLInputElement>('input[inputmode="decimal"]')?.focus();
  }, [hash, c.id]);

  return (
    <div className="flex flex-col gap-5">
      {back}
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="font-mono text-sm font-semibold text-accent-800">{c.labelCode}</p>
          <h1 className="text-xl font-semibold text-ink-900">
            <Link
              to={paths.stockChemical(c.chemical.id)}
              className="underline-offset-2 hover:underline"
            >
              {c.chemical.name}
            </Link>
          </h1>
          <p className="text-sm text-ink-600 tabular-nums">
            <Formula value={c.chemical.formula} />
            {c.chemical.casNumber && <> · CAS RN {c.chemical.casNumber}</>}
          </p>
        </div>
        <div className="flex flex-col items-end gap-1 text-right max-sm:w-full max-sm:flex-row max-sm:flex-wrap max-sm:items-center max-sm:text-left">
          <p className="text-2xl font-semibold text-ink-900 tabular-nums" data-testid="balance">
            {formatAmount(c.quantity, c.unit)}
          </p>
          <ContainerStatusBadge status={c.status} />
          <Link
            to={withQuery(paths.stockLabels, { ids: c.id })}
            className={`${buttonClasses('secondary', 'sm')} sm:mt-1`}
          >
            <Printer aria-hidden="true" className="size-4" />
            Print label
          </Link>
          {mayDraw && usable && (
            <Button
              variant="primary"
              size="sm"
              icon={<Scale aria-hidden="true" className="size-4" />}
              onClick={goToDrawForm}
            >
              Record a draw
            </Button>
          )}
        </div>
      </header>

      <ContainerHazards chemical={c.chemical} sds={c.sds ?? null} />
      <SegregationWarnings warnings={c.warnings} title={`Storage warnings at ${c.location.path}`} />

      <div className="grid gap-5 lg:grid-cols-[minmax(0,5fr)_minmax(0,4fr)]">
        <section
          aria-labelledby="container-facts-heading"
          className="rounded-lg border border-ink-200 bg-white px-4 py-3"
        >
          <h2 id="container-facts-heading" className="mb-1 text-base font-semibold">
            This container
          </h2>
          <dl>
            <Property term="Balance">
              <span className="font-semibold tabular-nums">{formatAmount(c.quantity, c.unit)}</span>
            </Property>
            <Property term="Held for plans">
              {c.holds.length === 0 ? (
                'Nothing held: free to draw'
              ) : (
                <>
                  <HoldList holds={c.holds} />
                  <span className="mt-0.5 block text-xs text-ink-600 tabular-nums">
                    Free: {formatAmount(freeOf(c), c.unit)}. Drawing into a hold asks first.
                  </span>
                </>
              )}
            </Property>
            <Property term="Status">
              <ContainerStatusBadge status={c.status} />
            </Property>
            <Property term="Location">
              <Link
                to={paths.stockLocation(c.location.id)}
                className="text-accent-700 underline-offset-2 hover:underline"
              >
                {c.location.path}
              </Link>
            </Property>
            <Property term="Belongs to">{c.owner ? c.owner.displayName : 'The lab'}</Property>
            <Property term="Tare (empty, cap on)">
              <span className="tabular-nums">
                {c.tareMass === null ? 'Not recorded' : formatAmount(c.tareMass, 'g')}
              </span>
            </Property>
            <Property term="Capacity">
              <span className="tabular-nums">
                {c.capacity === null ? '—' : formatAmount(c.capacity, c.capacityUnit ?? c.unit)}
              </span>
            </Property>
            <Property term="Material">
              <ContainerMaterialField key={c.material ?? ''} container={c} />
            </Property>
            <Property term="Opened on">
              {c.openedOn ? formatDate(c.openedOn) : 'Not opened'}
            </Property>
            <Property term="Expires on">
              <ExpiryText expiresOn={c.expiresOn} expired={c.expired} />
            </Property>
            {c.peroxide && (
              <Property term="Peroxide test">
                <PeroxideDueText peroxide={c.peroxide} />
                <span className="mt-0.5 block text-xs text-ink-600">{c.peroxide.rule}</span>
              </Property>
            )}
            <Property term="Lot">
              {lotSummary(c.lot)}
              <span className="block text-xs text-ink-600 tabular-nums">
                Received {formatDate(c.lot.receivedOn)} · purity{' '}
                {formatPercent(c.lot.purityPercent)}
              </span>
            </Property>
            {c.notes && (
              <Property term="Notes">
                <span className="whitespace-pre-line">{c.notes}</span>
              </Property>
            )}
          </dl>
          {mayWrite && (
            <div className="mt-3 border-t border-ink-100 pt-3">
              <ContainerActions container={c} />
            </div>
          )}
        </section>

        <section
          ref={drawRef}
          id="draw"
          aria-labelledby="draw-heading"
          className="scroll-mt-16 rounded-lg border border-ink-200 bg-white px-4 py-3"
        >
          <h2 id="draw-heading" className="mb-3 text-base font-semibold">
            Record a draw
          </h2>
          {!mayDraw ? (
            <p className="flex items-start gap-2 text-sm text-ink-700">
              <Lock aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-ink-500" />
              Your role can look at stock but not record use. Members, managers and admins record
              draws.
            </p>
          ) : !usable ? (
            <Notice tone="info">This container is {c.status}; nothing can be drawn from it.</Notice>
          ) : (
            <DrawForm key={c.id} container={c} />
          )}
        </section>
      </div>

      <LotCertificateSection lot={c.lot} />

      <section aria-labelledby="ledger-heading" className="flex flex-col gap-2">
        <h2 id="ledger-heading" className="text-base font-semibold">
          Ledger
        </h2>
        <p className="text-sm text-ink-600">
          Every change to this container, newest first. Entries are never edited; a mistake is put
          right by a new entry.
        </p>
        <LedgerTable containerId={c.id} />
      </section>
    </div>
  );
}

function LoadState({
  query,
  what,
  children,
}: {
  query: ReturnType<typeof useContainer>;
  what: string;
  children: (container: ContainerDetail) => ReactNode;
}) {
  if (query.isPending) return <PageSpinner label="Loading the container…" />;
  if (query.isError) {
    if (isApiError(query.error) && (query.error.status === 404 || query.error.status === 400)) {
      return (
        <div className="flex flex-col gap-4">
          {back}
          <Notice tone="warn" title="No such container">
            There is no container {what}. Check the label code, or search for the chemical.
          </Notice>
        </div>
      );
    }
    return (
      <div className="flex flex-col gap-4">
        {back}
        <ErrorState
          title="The container could not be loaded"
          error={query.error}
          onRetry={() => void query.refetch()}
        />
      </div>
    );
  }
  return children(query.data);
}

export function ContainerPage() {
  const params = useParams();
  const id = Number(params.id);
  const container = useContainer(id);
  return (
    <LoadState query={container} what={`number ${params.id}`}>
      {(c) => <ContainerView container={c} />}
    </LoadState>
  );
}

/**
 * `/stock/c/LW-00042`: what a label's QR code (read by any camera app) or a typed label code
 * opens; it lands on the container with the draw form ready.
 */
export function ContainerByLabelPage() {
  const { labelCode = '' } = useParams();
  const container = useContainerByLabel(labelCode);
  return (
    <LoadState query={container} what={`labelled ${labelCode}`}>
      {(c) => <Navigate to={`${paths.stockContainer(c.id)}#draw`} replace />}
    </LoadState>
  );
}
