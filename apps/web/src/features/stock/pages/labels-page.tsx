import { Link, useSearchParams } from 'react-router';
import { ChevronLeft, Printer, Tags } from 'lucide-react';
import { labelCodeToLookUp, type ContainerDetail } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-client';
import { usePublicSettings } from '../../../lib/public-settings';
import { formatCount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useContainerSet } from '../api';
import { FilterField } from '../components/filter-controls';
import {
  LabelSheets,
  labelGrid,
  labelsPerSheet,
  papers,
  type PaperSize,
} from '../components/label-sheet';

/** Most labels one sheet run asks for; more is a sign of a mistaken link. */
const maxLabels = 200;

function listParam(value: string | null): string[] {
  return (value ?? '')
    .split(',')
    .map((part) => part.trim())
    .filter(Boolean);
}

function readParams(searchParams: URLSearchParams) {
  const ids = [
    ...new Set(
      listParam(searchParams.get('ids'))
        .map(Number)
        .filter((n) => Number.isInteger(n) && n > 0),
    ),
  ];
  const labelCodes = [
    ...new Set(
      listParam(searchParams.get('labelCodes'))
        .map((code) => labelCodeToLookUp(code))
        .filter((code): code is string => code !== null),
    ),
  ];
  const paper: PaperSize = searchParams.get('paper') === 'letter' ? 'letter' : 'a4';
  const skip = Math.min(Math.max(Number(searchParams.get('skip')) || 0, 0), labelsPerSheet - 1);
  return { ids: ids.slice(0, maxLabels), labelCodes: labelCodes.slice(0, maxLabels), paper, skip };
}

/** `/stock/labels?ids=1,2,3` or `?labelCodes=LW-00001,…`: a printable sheet of labels. */
export function LabelsPage() {
  const [searchParams, setSearchParams] = useSearchParams();
  const { ids, labelCodes, paper, skip } = readParams(searchParams);
  const queries = useContainerSet(ids, labelCodes);
  // The QR codes carry the lab's public address, not this browser's.
  const settings = usePublicSettings();
  const publicUrl = settings.data?.publicUrl;
  const asked = [...ids.map((id) => `#${id}`), ...labelCodes];

  const loaded = queries.map((q) => q.data).filter((c): c is ContainerDetail => c !== undefined);
  const failed = queries
    .map((q, index) => ({ q, what: asked[index] ?? '' }))
    .filter(({ q }) => q.isError);
  const pending = queries.some((q) => q.isPending) || settings.isPending;

  const set = (key: string, value: string | undefined) =>
    setSearchParams(
      (previous) => {
        const next = new URLSearchParams(previous);
        if (value === undefined) next.delete(key);
        else next.set(key, value);
        return next;
      },
      { replace: true },
    );

  const sheetCount = Math.ceil((loaded.length + skip) / labelsPerSheet);

  return (
    <div className="flex flex-col gap-5">
      <style>{`@page { size: ${papers[paper].css} portrait; margin: 0; }`}</style>
      <div className="flex flex-col gap-5 print:hidden">
        <Link
          to={paths.stockContainers}
          className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
        >
          <ChevronLeft aria-hidden="true" className="size-4" />
          All containers
        </Link>
        <header>
          <h1 className="text-xl font-semibold text-ink-900">Labels</h1>
          <p className="max-w-3xl text-sm text-ink-600">
            {labelGrid.columns} × {labelGrid.rows} labels of {labelGrid.width} × {labelGrid.height}{' '}
            mm per sheet, on sticker sheets or plain paper to cut. The QR code opens the container
            in Lotwise at the lab’s address{publicUrl ? ` (${publicUrl})` : ''}, from any phone’s
            camera app, from “Scan a label”, or scanned into the search box. Print at 100 % (no “fit
            to page”) so the sizes stay true.
          </p>
        </header>

        <div className="flex flex-wrap items-end gap-3">
          <FilterField id="labels-paper" label="Paper">
            <Select
              id="labels-paper"
              className="w-52"
              value={paper}
              onChange={(event) =>
                set('paper', event.target.value === 'letter' ? 'letter' : undefined)
              }
            >
              {(Object.keys(papers) as PaperSize[]).map((size) => (
                <option key={size} value={size}>
                  {papers[size].label}
                </option>
              ))}
            </Select>
          </FilterField>
          <FilterField id="labels-skip" label="Start at label">
            <Select
              id="labels-skip"
              className="w-44"
              value={skip}
              onChange={(event) =>
                set('skip', event.target.value === '0' ? undefined : event.target.value)
              }
            >
              {Array.from({ length: labelsPerSheet }, (_, i) => (
                <option key={i} value={i}>
                  {i === 0 ? '1 (a fresh sheet)' : `${i + 1} (${i} used)`}
                </option>
              ))}
            </Select>
          </FilterField>
          <Button
            variant="primary"
            disabled={loaded.length === 0 || pending || !publicUrl}
            onClick={() => window.print()}
            icon={<Printer aria-hidden="true" className="size-4" />}
          >
            Print
          </Button>
          {loaded.length > 0 && (
            <p className="pb-2 text-sm text-ink-700 tabular-nums">
              {formatCount(loaded.length)} {loaded.length === 1 ? 'label' : 'labels'} on{' '}
              {formatCount(sheetCount)} {sheetCount === 1 ? 'sheet' : 'sheets'}
            </p>
          )}
        </div>

        {settings.isError && (
          <Notice tone="danger" title="The lab’s address could not be read">
            The QR codes need it so that any phone opens the container:{' '}
            {errorMessage(settings.error)}{' '}
            <Button size="sm" variant="secondary" onClick={() => void settings.refetch()}>
              Try again
            </Button>
          </Notice>
        )}
        {failed.length > 0 && (
          <Notice tone="warn" title={`${failed.length} of the labels asked for cannot be made`}>
            <ul>
              {failed.map(({ q, what }) => (
                <li key={what}>
                  {what}: {errorMessage(q.error)}
                </li>
              ))}
            </ul>
          </Notice>
        )}
        <SafetyCaution compact />
      </div>

      {asked.length === 0 ? (
        <EmptyState icon={<Tags />} title="No containers chosen">
          Open a container and press “Print label”, or choose containers in the list and press
          “Print labels”.
        </EmptyState>
      ) : (pending && loaded.length === 0) || !publicUrl ? (
        settings.isError ? null : (
          <PageSpinner label="Preparing the labels…" />
        )
      ) : (
        <LabelSheets containers={loaded} paper={paper} skip={skip} publicUrl={publicUrl} />
      )}
    </div>
  );
}
