import { ChevronLeft, ChevronRight, ChevronsLeft, ChevronsRight } from 'lucide-react';
import { useId } from 'react';
import { formatCount } from '../../lib/format';
import { pageSizeOptions } from '../../lib/list-search-params';
import { Button } from './button';
import { Select } from './input';

interface PaginationProps {
  page: number;
  pageCount: number;
  pageSize: number;
  total: number;
  /** What the rows are, plural (e.g. `chemicals`). */
  noun: string;
  onPageChange: (page: number) => void;
  onPageSizeChange: (pageSize: number) => void;
}

export function Pagination({
  page,
  pageCount,
  pageSize,
  total,
  noun,
  onPageChange,
  onPageSizeChange,
}: PaginationProps) {
  const sizeId = useId();
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(page * pageSize, total);
  const lastPage = Math.max(pageCount, 1);

  return (
    <nav
      aria-label="Pages"
      className="flex flex-wrap items-center justify-between gap-3 px-1 py-3 text-sm text-ink-700"
    >
      <p className="tabular-nums" aria-live="polite">
        {total === 0
          ? `No ${noun}`
          : `${formatCount(first)}–${formatCount(last)} of ${formatCount(total)} ${noun}`}
      </p>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <div className="flex items-center gap-2">
          <label htmlFor={sizeId} className="whitespace-nowrap">
            Rows per page
          </label>
          <Select
            id={sizeId}
            className="w-20"
            value={pageSize}
            onChange={(event) => onPageSizeChange(Number(event.target.value))}
          >
            {pageSizeOptions.map((size) => (
              <option key={size} value={size}>
                {size}
              </option>
            ))}
          </Select>
        </div>
        <div className="flex items-center gap-1">
          <Button
            size="sm"
            variant="ghost"
            aria-label="First page"
            disabled={page <= 1}
            onClick={() => onPageChange(1)}
            icon={<ChevronsLeft aria-hidden="true" className="size-4" />}
          />
          <Button
            size="sm"
            variant="ghost"
            aria-label="Previous page"
            disabled={page <= 1}
            onClick={() => onPageChange(page - 1)}
            icon={<ChevronLeft aria-hidden="true" className="size-4" />}
          />
          <span className="px-2 tabular-nums whitespace-nowrap">
            Page {formatCount(page)} of {formatCount(lastPage)}
          </span>
          <Button
            size="sm"
            variant="ghost"
            aria-label="Next page"
            disabled={page >= lastPage}
            onClick={() => onPageChange(page + 1)}
            icon={<ChevronRight aria-hidden="true" className="size-4" />}
          />
          <Button
            size="sm"
            variant="ghost"
            aria-label="Last page"
            disabled={page >= lastPage}
            onClick={() => onPageChange(lastPage)}
            icon={<ChevronsRight aria-hidden="true" className="size-4" />}
          />
        </div>
      </div>
    </nav>
  );
}
