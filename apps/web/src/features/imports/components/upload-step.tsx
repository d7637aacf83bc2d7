import { Download } from 'lucide-react';
import { importColumns, importRowLimit, priceListColumns, type ImportKind } from '@lotwise/shared';
import { buttonClasses } from '../../../components/ui/button';
import { FileDrop } from '../../../components/ui/file-drop';
import { Notice } from '../../../components/ui/notice';
import { ProgressBar } from '../../../components/ui/progress-bar';
import { formatCount } from '../../../lib/format';
import { formatFileSize, uploadErrorMessage, type UploadProgress } from '../../../lib/upload';
import { exampleCsvHrefs } from '../api';
import { TableScroll } from '../../../components/ui/table-scroll';

/** A column as the guide lists it (stock and price-list columns alike). */
interface GuideColumn {
  key: string;
  header: string;
  required: boolean;
  description: string;
  example: string;
}

/** What the page says per kind of file. */
const kindTexts: Record<ImportKind, { rowIs: string; columns: readonly GuideColumn[] }> = {
  stock: { rowIs: 'One row per container.', columns: importColumns },
  'price-list': {
    rowIs: 'One row per pack the supplier sells. Prices are per pack, in the lab’s currency.',
    columns: priceListColumns,
  },
};

function ColumnGuide({ kind }: { kind: ImportKind }) {
  return (
    <details className="rounded-lg border border-ink-200 bg-white px-4 py-3 text-sm">
      <summary className="cursor-pointer font-semibold text-ink-900">
        The columns Lotwise reads
      </summary>
      <p className="mt-2 text-ink-700">
        {kindTexts[kind].rowIs} Headers may be written in any letter case; the first row must hold
        them. Columns Lotwise does not know are ignored (the preview says which).
      </p>
      <TableScroll className="mt-2">
        <table className="w-full text-left text-sm">
          <thead className="border-b border-ink-200 text-xs tracking-wide text-ink-600 uppercase">
            <tr>
              <th className="py-1.5 pr-3">Header</th>
              <th className="py-1.5 pr-3">Needed</th>
              <th className="py-1.5 pr-3">What it holds</th>
              <th className="py-1.5">Example</th>
            </tr>
          </thead>
          <tbody>
            {kindTexts[kind].columns.map((column) => (
              <tr key={column.key} className="border-b border-ink-100 align-top last:border-b-0">
                <td className="py-1.5 pr-3 font-medium whitespace-nowrap">{column.header}</td>
                <td className="py-1.5 pr-3">{column.required ? 'yes' : 'no'}</td>
                <td className="py-1.5 pr-3 text-ink-700">{column.description}</td>
                <td className="py-1.5">
                  <code className="rounded bg-ink-100 px-1 text-xs whitespace-nowrap">
                    {column.example}
                  </code>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroll>
    </details>
  );
}

/** The first step of an import: the file, the example file and the column guide. */
export function UploadStep({
  onFile,
  progress,
  error,
  fileName,
  kind,
  blocked,
}: {
  onFile: (file: File) => void;
  progress: UploadProgress | null;
  error: unknown;
  fileName: string | null;
  kind: ImportKind;
  /** Why no file can be taken yet (a price list without its supplier). */
  blocked?: string | null;
}) {
  return (
    <div className="flex flex-col gap-4">
      {blocked && <Notice tone="info">{blocked}</Notice>}
      <FileDrop
        accept=".csv,text/csv,text/plain"
        onFile={onFile}
        disabled={progress !== null || Boolean(blocked)}
        title="Drop the CSV file here, or choose it"
      >
        Saved from a spreadsheet as CSV (comma separated, UTF-8), up to{' '}
        {formatCount(importRowLimit)} rows. Nothing is written until you have seen the preview and
        confirmed.
      </FileDrop>
      {progress && (
        <ProgressBar
          label={`Uploading ${fileName ?? 'the file'}`}
          value={progress.loaded}
          max={progress.total}
          detail={`${formatFileSize(progress.loaded)} of ${formatFileSize(progress.total)} sent`}
        />
      )}
      {error !== null && error !== undefined && (
        <Notice tone="danger" title="The file was not accepted">
          {uploadErrorMessage(error, 'csv')}
        </Notice>
      )}
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <a
          href={exampleCsvHrefs[kind]}
          download={`lotwise-${kind}-import-example.csv`}
          className={buttonClasses('secondary', 'sm')}
        >
          <Download aria-hidden="true" className="size-4" />
          Download the example CSV
        </a>
        <span className="text-ink-600">
          Every column, with a few rows of invented {kind === 'stock' ? 'stock' : 'prices'}: replace
          them with yours, or match your own headers to it.
        </span>
      </div>
      <ColumnGuide kind={kind} />
    </div>
  );
}
