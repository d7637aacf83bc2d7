import { createColumnHelper } from '@tanstack/react-table';
import { CircleCheck } from 'lucide-react';
import type { ImportProblem } from '@lotwise/shared';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { fieldMessage } from '../../../components/ui/field';
import { ServerTable } from '../../../components/ui/server-table';
import { cn } from '../../../lib/cn';

type ProblemRow = ImportProblem & { key: string };

const column = createColumnHelper<ServerTableFeatures, ProblemRow>();

const columns = column.columns([
  column.accessor('row', {
    header: 'Row',
    enableSorting: false,
    meta: { align: 'right', width: 'w-20' },
    cell: ({ getValue }) => {
      const row = getValue();
      return row === null ? <span className="text-ink-600">File</span> : row;
    },
  }),
  column.accessor('column', {
    header: 'Column',
    enableSorting: false,
    cell: ({ getValue }) => (
      <span className="font-medium whitespace-nowrap text-ink-900">{getValue() ?? '—'}</span>
    ),
  }),
  column.accessor('value', {
    header: 'In the file',
    enableSorting: false,
    cell: ({ getValue }) => {
      const value = getValue();
      if (value === null) return <span className="text-ink-500">—</span>;
      if (value === '') return <span className="text-ink-600 italic">empty</span>;
      return (
        <code
          className={cn(
            'rounded bg-ink-100 px-1 text-xs',
            value.length > 24 ? 'break-all' : 'whitespace-nowrap',
          )}
        >
          {value}
        </code>
      );
    },
  }),
  column.accessor('message', {
    header: 'What is wrong',
    enableSorting: false,
    // "is before the received date" reads as a sentence with its column: "Expires on is …".
    cell: ({ row }) => (
      <span className="text-ink-800">
        {row.original.column
          ? fieldMessage(row.original.column, row.original.message)
          : row.original.message}
      </span>
    ),
  }),
]);

/**
 * The problems of an import, one line per cell (or row, or the whole file), paged by the
 * server. Row numbers are the spreadsheet's: the header is row 1.
 */
export function ImportErrorsTable({
  problems,
  total,
  page,
  pageSize,
  loading,
  refreshing,
  onPageChange,
  onPageSizeChange,
}: {
  problems: ImportProblem[] | undefined;
  total: number;
  page: number;
  pageSize: number;
  loading: boolean;
  refreshing: boolean;
  onPageChange: (page: number) => void;
  onPageSizeChange: (pageSize: number) => void;
}) {
  const rows = problems?.map((problem, index) => ({
    ...problem,
    key: `${page}-${index}`,
  }));
  return (
    <ServerTable
      columns={columns}
      rows={rows}
      getRowId={(row) => row.key}
      total={total}
      sort="row.asc"
      page={page}
      pageSize={pageSize}
      loading={loading}
      refreshing={refreshing}
      label="Problems in the file"
      noun={['problem', 'problems']}
      onSortChange={() => {}}
      onPageChange={onPageChange}
      onPageSizeChange={onPageSizeChange}
      empty={
        <EmptyState icon={<CircleCheck />} title="No problems found">
          Every row can be imported.
        </EmptyState>
      }
    />
  );
}
