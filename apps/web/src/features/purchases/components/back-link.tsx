import { Link } from 'react-router';
import { ChevronLeft } from 'lucide-react';

/** The way back to the list a page was opened from (hidden when printing). */
export function BackLink({ to, children }: { to: string; children: React.ReactNode }) {
  return (
    <Link
      to={to}
      className="inline-flex items-center gap-1 self-start text-sm text-ink-600 hover:text-ink-900 print:hidden"
    >
      <ChevronLeft aria-hidden="true" className="size-4" />
      {children}
    </Link>
  );
}
