import { useEffect, useRef, useState, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

/**
 * The frame of a table (or a preview of a printed sheet) that may be wider than the screen. While it is (a phone, a long row),
 * the frame scrolls sideways and takes the keyboard focus, so arrow keys scroll it too; when
 * everything fits it is no stop on the way through the page.
 */
export function TableScroll({
  label,
  className,
  children,
}: {
  /** Names the scrolling region for screen readers, e.g. the table's caption. */
  label?: string;
  className?: string;
  children: ReactNode;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const [overflowing, setOverflowing] = useState(false);

  useEffect(() => {
    const frame = ref.current;
    if (!frame) return;
    const measure = () => setOverflowing(frame.scrollWidth > frame.clientWidth + 1);
    measure();
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(measure);
    observer.observe(frame);
    for (const child of Array.from(frame.children)) observer.observe(child);
    return () => observer.disconnect();
  }, []);

  return (
    <div
      ref={ref}
      role={overflowing && label ? 'region' : undefined}
      aria-label={overflowing ? label : undefined}
      tabIndex={overflowing ? 0 : undefined}
      className={cn('overflow-x-auto', className)}
    >
      {children}
    </div>
  );
}
