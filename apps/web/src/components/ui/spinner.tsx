import { cn } from '../../lib/cn';

/** A small turning ring. Decorative: pair it with text or `aria-busy` on the region. */
export function Spinner({ size = 'md', className }: { size?: 'sm' | 'md'; className?: string }) {
  return (
    <span
      aria-hidden="true"
      className={cn(
        'inline-block animate-spin rounded-full border-2 border-current border-r-transparent',
        size === 'sm' ? 'size-3.5' : 'size-5',
        className,
      )}
    />
  );
}

/** A centred spinner with a label, for whole-page loading. */
export function PageSpinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center justify-center gap-3 py-16 text-ink-600">
      <Spinner />
      <span>{label}</span>
    </div>
  );
}

export function Skeleton({ className }: { className?: string }) {
  return (
    <span aria-hidden="true" className={cn('block animate-pulse rounded bg-ink-200', className)} />
  );
}

/** Grey placeholder rows shown while a page of a table loads for the first time. */
export function SkeletonRows({ rows = 6, columns }: { rows?: number; columns: number }) {
  return (
    <>
      {Array.from({ length: rows }, (_, row) => (
        <tr key={row} className="border-b border-ink-100">
          {Array.from({ length: columns }, (_, col) => (
            <td key={col} className="px-3 py-3">
              <Skeleton className={cn('h-3.5', col === 0 ? 'w-40' : 'w-20')} />
            </td>
          ))}
        </tr>
      ))}
    </>
  );
}
