import { useState, type ReactNode } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import { ChevronLeft, FileText, Lock, Package, Pencil, Trash2 } from 'lucide-react';
import { Formula } from '../../../components/chem/formula';
import { Badge } from '../../../components/ui/badge';
import { Button, buttonClasses } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/dialog';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import {
  formatAmount,
  formatDateTime,
  formatDensity,
  formatMolarMass,
  formatPercent,
} from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useChemical, useDeleteChemical } from '../api';
import { FireDataSection } from '../components/fire-data-section';
import { HazardSection } from '../components/hazard-section';
import { physicalStateLabels } from '../labels';

function Property({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 border-b border-ink-100 py-2 sm:flex-row sm:gap-4">
      <dt className="w-44 shrink-0 text-sm text-ink-600">{term}</dt>
      <dd className="text-sm text-ink-900">{children}</dd>
    </div>
  );
}

export function ChemicalDetailPage() {
  const params = useParams();
  const id = Number(params.id);
  const chemical = useChemical(id);
  const mayWrite = useCan('chemicals.write');
  const mayReadStock = useCan('stock.read');
  const navigate = useNavigate();
  const remove = useDeleteChemical();
  const [confirming, setConfirming] = useState(false);

  const back = (
    <Link
      to={paths.chemicals}
      className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
    >
      <ChevronLeft aria-hidden="true" className="size-4" />
      All chemicals
    </Link>
  );

  if (chemical.isPending) return <PageSpinner label="Loading the chemical…" />;
  if (chemical.isError) {
    if (isApiError(chemical.error) && chemical.error.status === 404) {
      return (
        <div className="flex flex-col gap-4">
          {back}
          <Notice tone="warn" title="No such chemical">
            There is no chemical with the number {params.id} — it may have been deleted.
          </Notice>
        </div>
      );
    }
    return (
      <div className="flex flex-col gap-4">
        {back}
        <ErrorState
          title="The chemical could not be loaded"
          error={chemical.error}
          onRetry={() => void chemical.refetch()}
        />
      </div>
    );
  }

  const c = chemical.data;

  function handleDelete() {
    remove.mutate(c.id, { onSuccess: () => navigate(paths.chemicals, { replace: true }) });
  }

  return (
    <div className="flex flex-col gap-5">
      {back}
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="flex flex-wrap items-center gap-2 text-xl font-semibold text-ink-900">
            {c.name}
            {c.restricted && (
              <Badge tone="warn" icon={<Lock aria-hidden="true" />}>
                Restricted
              </Badge>
            )}
          </h1>
          {c.synonyms.length > 0 && (
            <p className="text-sm text-ink-600">Also known as {c.synonyms.join('; ')}</p>
          )}
          {mayReadStock && (
            <Link
              to={paths.stockChemical(c.id)}
              className="mt-1 inline-flex items-center gap-1 text-sm text-accent-700 underline-offset-2 hover:underline"
            >
              <Package aria-hidden="true" className="size-4" />
              Stock, containers and where they are
            </Link>
          )}
          {c.sds && (
            <a
              href={`/api/chemicals/${c.id}/sds`}
              download={c.sds.fileName}
              className="mt-1 ml-4 inline-flex items-center gap-1 text-sm text-accent-700 underline-offset-2 hover:underline"
            >
              <FileText aria-hidden="true" className="size-4" />
              SDS: download
            </a>
          )}
        </div>
        {mayWrite && (
          <div className="flex gap-2">
            <Link to={paths.chemicalEdit(c.id)} className={buttonClasses('secondary')}>
              <Pencil aria-hidden="true" className="size-4" />
              Edit
            </Link>
            <Button
              variant="secondary"
              onClick={() => setConfirming(true)}
              icon={<Trash2 aria-hidden="true" className="size-4" />}
            >
              Delete
            </Button>
          </div>
        )}
      </header>

      <HazardSection chemical={c} />

      <FireDataSection chemical={c} />

      <section
        aria-labelledby="properties-heading"
        className="rounded-lg border border-ink-200 bg-white px-4 py-3"
      >
        <h2 id="properties-heading" className="mb-1 text-base font-semibold">
          Properties
        </h2>
        <dl>
          <Property term="CAS RN">
            <span className="tabular-nums">{c.casNumber ?? '—'}</span>
          </Property>
          <Property term="Formula">
            <Formula value={c.formula} />
          </Property>
          <Property term="Molar mass">
            <span className="tabular-nums">{formatMolarMass(c.molarMass)}</span>
          </Property>
          <Property term="Physical state">{physicalStateLabels[c.physicalState]}</Property>
          <Property term={c.physicalState === 'solid' ? 'Crystal density' : 'Density at 20 °C'}>
            <span className="tabular-nums">{formatDensity(c.density)}</span>
          </Property>
          {c.physicalState === 'solid' && (
            <Property term="Bulk density (poured)">
              {c.bulkDensity === null ? (
                <span className="text-ink-600">
                  Not recorded: this solid is weighed, never measured by volume
                </span>
              ) : (
                <span className="tabular-nums">
                  {formatDensity(c.bulkDensity)}
                  <span className="block text-xs text-ink-600">
                    used when it is measured by volume
                  </span>
                </span>
              )}
            </Property>
          )}
          <Property term="Default purity">
            <span className="tabular-nums">{formatPercent(c.defaultPurityPercent)}</span>
          </Property>
          <Property term="Stock counted in">{c.stockUnit}</Property>
          <Property term="Reorder point">
            <span className="tabular-nums">{formatAmount(c.reorderPoint, c.stockUnit)}</span>
          </Property>
          <Property term="Reorder quantity">
            <span className="tabular-nums">{formatAmount(c.reorderQuantity, c.stockUnit)}</span>
          </Property>
          <Property term="Orders">
            {c.restricted ? 'Restricted: orders need a manager’s approval' : 'No approval needed'}
          </Property>
          <Property term="Notes">
            {c.notes ? (
              <span className="whitespace-pre-line">{c.notes}</span>
            ) : (
              <span className="text-ink-600">None</span>
            )}
          </Property>
          <Property term="Last changed">{formatDateTime(c.updatedAt)}</Property>
          <Property term="Added">{formatDateTime(c.createdAt)}</Property>
        </dl>
      </section>

      <ConfirmDialog
        open={confirming}
        title={`Delete ${c.name}?`}
        confirmLabel="Delete chemical"
        busy={remove.isPending}
        onConfirm={handleDelete}
        onCancel={() => {
          setConfirming(false);
          remove.reset();
        }}
        error={
          remove.isError && (
            <Notice tone="danger" title="Not deleted">
              {errorMessage(remove.error)}
            </Notice>
          )
        }
      >
        <p>
          This removes {c.name} from the chemicals list. It cannot be undone. A chemical that still
          has lots or appears in procedures cannot be deleted.
        </p>
      </ConfirmDialog>
    </div>
  );
}
