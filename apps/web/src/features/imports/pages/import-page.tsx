import { useEffect, useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { ChevronLeft, CircleCheck, FileWarning, Upload } from 'lucide-react';
import type { Import, ImportKind } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button, buttonClasses } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { FileDrop } from '../../../components/ui/file-drop';
import { Notice } from '../../../components/ui/notice';
import { ProgressBar } from '../../../components/ui/progress-bar';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage, withQuery } from '../../../lib/api-client';
import { formatCount } from '../../../lib/format';
import type { UploadProgress } from '../../../lib/upload';
import { paths } from '../../../config/paths';
import {
  isWorking,
  useCommitImport,
  useImport,
  useRefreshAfterImport,
  useUploadImport,
} from '../api';
import { ImportErrorsTable } from '../components/import-errors-table';
import { ImportSummaryTiles } from '../components/import-summary';
import { PriceListSummaryView, SupplierChoice } from '../components/price-list-parts';
import { UploadStep } from '../components/upload-step';

const allOrNothing =
  'The import is all or nothing: every row is written in one go when you confirm, or none is.';

const rows = (n: number) => `${formatCount(n)} ${n === 1 ? 'row' : 'rows'}`;

function Preview({
  data,
  errorsPage,
  errorsPageSize,
  onErrorsPage,
  onErrorsPageSize,
  refreshing,
  onReupload,
}: {
  data: Import;
  errorsPage: number;
  errorsPageSize: number;
  onErrorsPage: (page: number) => void;
  onErrorsPageSize: (size: number) => void;
  refreshing: boolean;
  onReupload: (file: File) => void;
}) {
  const commit = useCommitImport(data.id);
  const rowCount = data.summary?.rows ?? data.priceList?.rows ?? data.totalRows;
  const blankRows = data.summary?.blankRowsSkipped ?? data.priceList?.blankRowsSkipped ?? 0;
  const invalid = data.status === 'invalid' || data.errorCount > 0;
  const blockedReason = invalid
    ? `Cannot import: the file has ${formatCount(data.errorCount)} ${data.errorCount === 1 ? 'problem' : 'problems'}. Correct ${data.errorCount === 1 ? 'it' : 'them'} in the spreadsheet and upload the file again.`
    : rowCount === 0
      ? `Cannot import: the file has no rows of ${data.kind === 'stock' ? 'stock' : 'prices'}.`
      : null;

  return (
    <div className="flex flex-col gap-5">
      <section aria-labelledby="preview-heading" className="flex flex-col gap-3">
        <h2 id="preview-heading" className="text-base font-semibold">
          Preview of {data.fileName}
        </h2>
        <p className="text-sm text-ink-700 tabular-nums">
          {rows(rowCount)} read
          {blankRows > 0 && <>, {rows(blankRows)} left blank and skipped</>}.{' '}
          {invalid
            ? 'Nothing can be imported until every problem is fixed.'
            : 'Nothing has been written yet.'}
        </p>
        {data.summary && <ImportSummaryTiles summary={data.summary} />}
        {data.priceList && <PriceListSummaryView summary={data.priceList} />}
        {data.warnings.length > 0 && (
          <Notice tone="warn" title="Worth a look (these do not stop the import)">
            <ul className="list-disc pl-4">
              {data.warnings.map((warning) => (
                <li key={warning}>{warning}</li>
              ))}
            </ul>
          </Notice>
        )}
      </section>

      {data.errorCount > 0 && (
        <section aria-labelledby="problems-heading" className="flex flex-col gap-2">
          <h2 id="problems-heading" className="flex items-center gap-2 text-base font-semibold">
            <FileWarning aria-hidden="true" className="size-4 text-danger-700" />
            {formatCount(data.errorCount)} {data.errorCount === 1 ? 'problem' : 'problems'} to fix
          </h2>
          <p className="text-sm text-ink-600">
            Row numbers are those the spreadsheet shows (the header is row 1).
          </p>
          <ImportErrorsTable
            problems={data.errors}
            total={data.errorCount}
            page={errorsPage}
            pageSize={errorsPageSize}
            loading={false}
            refreshing={refreshing}
            onPageChange={onErrorsPage}
            onPageSizeChange={onErrorsPageSize}
          />
        </section>
      )}

      <section
        aria-labelledby="confirm-heading"
        className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
      >
        <h2 id="confirm-heading" className="text-base font-semibold">
          Import
        </h2>
        <p className="text-sm text-ink-700">{allOrNothing}</p>
        {commit.isError && (
          <Notice tone="danger" title="Nothing was imported">
            {errorMessage(commit.error)}
          </Notice>
        )}
        <div className="flex flex-wrap items-center gap-3">
          <Button
            variant="primary"
            disabled={blockedReason !== null}
            busy={commit.isPending}
            aria-describedby={blockedReason ? 'import-blocked' : undefined}
            onClick={() => commit.mutate()}
            icon={<CircleCheck aria-hidden="true" className="size-4" />}
          >
            Import {rows(rowCount)}
          </Button>
          {blockedReason && (
            <p id="import-blocked" className="text-sm font-medium text-danger-700">
              {blockedReason}
            </p>
          )}
        </div>
        <div className="border-t border-ink-100 pt-3">
          <FileDrop
            accept=".csv,text/csv,text/plain"
            onFile={onReupload}
            title={invalid ? 'Upload the corrected file' : 'Upload another file instead'}
          >
            This preview is dropped and the new file is checked from the start.
          </FileDrop>
        </div>
      </section>
    </div>
  );
}

function Committed({ data, onAnother }: { data: Import; onAnother: () => void }) {
  const refresh = useRefreshAfterImport();
  useEffect(() => {
    void refresh();
    // Once, when the import is done.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [data.id]);
  return (
    <div className="flex flex-col gap-4">
      <Notice tone="ok" title={`${data.fileName} is imported`}>
        {rows(data.summary?.rows ?? data.priceList?.rows ?? data.totalRows)} written in one go
        {data.createdBy && <> by {data.createdBy.displayName}</>}.
      </Notice>
      {data.summary && <ImportSummaryTiles summary={data.summary} done />}
      {data.priceList && <PriceListSummaryView summary={data.priceList} done />}
      {data.kind === 'price-list' ? (
        <div className="flex flex-wrap gap-2">
          {data.supplier && (
            <Link to={paths.supplier(data.supplier.id)} className={buttonClasses('primary')}>
              See the catalogue of {data.supplier.name}
            </Link>
          )}
          <Button onClick={onAnother} icon={<Upload aria-hidden="true" className="size-4" />}>
            Import another file
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Link
            to={withQuery(paths.stockContainers, { sort: 'updatedAt.desc' })}
            className={buttonClasses('primary')}
          >
            See the containers
          </Link>
          <Link to={paths.stock} className={buttonClasses('secondary')}>
            Stock overview
          </Link>
          <Link to={paths.stockLocations} className={buttonClasses('secondary')}>
            Locations
          </Link>
          <Button onClick={onAnother} icon={<Upload aria-hidden="true" className="size-4" />}>
            Import another file
          </Button>
        </div>
      )}
      {data.summary && data.summary.chemicals.new > 0 && (
        <p className="text-sm text-ink-700">
          New chemicals carry only what the file said about them: check their hazards, storage group
          and reorder point on the chemicals list.
        </p>
      )}
    </div>
  );
}

/**
 * `/stock/import`: existing stock from a spreadsheet, checked and previewed before it is
 * written; with `?kind=price-list&supplierId=3`, a supplier's price list.
 */
export function ImportPage() {
  const [searchParams, setSearchParams] = useSearchParams();
  const importId = Number(searchParams.get('import')) || null;
  const askedKind: ImportKind = searchParams.get('kind') === 'price-list' ? 'price-list' : 'stock';
  const supplierId = Number(searchParams.get('supplierId')) || null;
  const [errorsPage, setErrorsPage] = useState(1);
  const [errorsPageSize, setErrorsPageSize] = useState(25);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [fileName, setFileName] = useState<string | null>(null);
  const upload = useUploadImport();
  const current = useImport(importId, errorsPage, errorsPageSize);

  const show = (id: number | null) => {
    setErrorsPage(1);
    setSearchParams(
      (previous) => {
        const next = new URLSearchParams(previous);
        if (id === null) next.delete('import');
        else next.set('import', String(id));
        return next;
      },
      { replace: id === null },
    );
  };

  function handleFile(file: File) {
    setFileName(file.name);
    setProgress({ loaded: 0, total: file.size });
    show(null);
    upload.mutate(
      {
        file,
        onProgress: setProgress,
        target: kind === 'price-list' ? { kind, supplierId } : undefined,
      },
      {
        onSuccess: (result) => show(result.id),
        onSettled: () => setProgress(null),
      },
    );
  }

  const data = current.data;
  const kind = data?.kind ?? askedKind;
  const chooseSupplier = (id: number) =>
    setSearchParams((previous) => {
      const next = new URLSearchParams(previous);
      next.set('supplierId', String(id));
      next.delete('import');
      return next;
    });
  const blocked =
    kind === 'price-list' && supplierId === null
      ? 'Choose the supplier first: the file is read as that supplier’s price list.'
      : null;
  let body;
  if (importId === null || progress !== null) {
    body = (
      <UploadStep
        onFile={handleFile}
        progress={progress}
        error={upload.isError ? upload.error : null}
        fileName={fileName}
        kind={kind}
        blocked={blocked}
      />
    );
  } else if (current.isPending) {
    body = <PageSpinner label="Loading the import…" />;
  } else if (current.isError && !data) {
    body = (
      <ErrorState
        title="The import could not be loaded"
        error={current.error}
        onRetry={() => void current.refetch()}
      />
    );
  } else if (data && isWorking(data.status)) {
    const checking = data.status === 'validating';
    body = (
      <div className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-4">
        <ProgressBar
          label={checking ? `Checking ${data.fileName}` : `Importing ${data.fileName}`}
          value={data.processedRows}
          max={data.totalRows}
          detail={`${formatCount(data.processedRows)} of ${formatCount(data.totalRows)} rows ${checking ? 'checked' : 'written'}`}
        />
        <p className="text-sm text-ink-600">
          {checking
            ? 'Every row is checked before anything is written. You can leave this page and come back.'
            : 'Writing all rows in one transaction: if anything fails, none is kept.'}
        </p>
      </div>
    );
  } else if (data && data.status === 'committed') {
    body = <Committed data={data} onAnother={() => show(null)} />;
  } else if (data && data.status === 'failed') {
    body = (
      <div className="flex flex-col gap-4">
        <Notice tone="danger" title="Nothing was imported">
          {data.failure ?? 'The import stopped.'} No row of {data.fileName} was written.
        </Notice>
        <UploadStep
          onFile={handleFile}
          progress={null}
          error={null}
          fileName={null}
          kind={kind}
          blocked={blocked}
        />
      </div>
    );
  } else if (data) {
    body = (
      <Preview
        data={data}
        errorsPage={errorsPage}
        errorsPageSize={errorsPageSize}
        onErrorsPage={setErrorsPage}
        onErrorsPageSize={(size) => {
          setErrorsPageSize(size);
          setErrorsPage(1);
        }}
        refreshing={current.isPlaceholderData || current.isFetching}
        onReupload={handleFile}
      />
    );
  }

  return (
    <div className="flex flex-col gap-5">
      <Link
        to={
          kind === 'stock'
            ? paths.stockContainers
            : supplierId
              ? paths.supplier(supplierId)
              : paths.suppliers
        }
        className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
      >
        <ChevronLeft aria-hidden="true" className="size-4" />
        {kind === 'stock' ? 'All containers' : 'Back to the supplier'}
      </Link>
      {kind === 'stock' ? (
        <header>
          <h1 className="text-xl font-semibold text-ink-900">Import stock from CSV</h1>
          <p className="max-w-3xl text-sm text-ink-600">
            Bring in an existing stock list: chemicals, lots, containers and their places (by path)
            in one file. Lotwise checks every row and shows what it would add. {allOrNothing}
          </p>
        </header>
      ) : (
        <header className="flex flex-col gap-3">
          <div>
            <h1 className="text-xl font-semibold text-ink-900">Import a price list from CSV</h1>
            <p className="max-w-3xl text-sm text-ink-600">
              Bring in a supplier’s catalogue: one row per pack, matched to chemicals Lotwise
              already knows. Known article numbers get the new price; new ones are added. Lotwise
              checks every row and shows what would change. {allOrNothing}
            </p>
          </div>
          {importId === null && (
            <SupplierChoice supplierId={supplierId} onChange={chooseSupplier} />
          )}
        </header>
      )}
      {body}
      <SafetyCaution compact />
    </div>
  );
}
