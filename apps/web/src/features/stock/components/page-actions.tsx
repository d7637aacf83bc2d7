import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { Download, FileUp, PackagePlus } from 'lucide-react';
import { buttonClasses } from '../../../components/ui/button';
import { useCan } from '../../../lib/auth';
import { paths } from '../../../config/paths';

/** A page title with its actions on the right (wrapping under it on narrow screens). */
export function PageHeader({
  title,
  children,
  actions,
}: {
  title: string;
  children?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <header className="flex flex-wrap items-start justify-between gap-3">
      <div className="max-w-3xl">
        <h1 className="text-xl font-semibold text-ink-900">{title}</h1>
        {children && <p className="text-sm text-ink-600">{children}</p>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2">{actions}</div>}
    </header>
  );
}

/** "Receive stock" and "Import CSV", for roles that may add stock. */
export function AddStockLinks() {
  const mayWrite = useCan('stock.write');
  if (!mayWrite) return null;
  return (
    <>
      <Link to={paths.stockImport} className={buttonClasses('secondary')}>
        <FileUp aria-hidden="true" className="size-4" />
        Import CSV
      </Link>
      <Link to={paths.stockReceive} className={buttonClasses('primary')}>
        <PackagePlus aria-hidden="true" className="size-4" />
        Receive stock
      </Link>
    </>
  );
}

/**
 * Downloads of what the list shows (its filters, every page), with the one thing a person
 * opening the file in a spreadsheet should know.
 */
export function CsvDownloads({ links }: { links: { href: string; label: string }[] }) {
  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1.5">
      {links.map((link) => (
        <a key={link.href} href={link.href} download className={buttonClasses('secondary', 'sm')}>
          <Download aria-hidden="true" className="size-4" />
          {link.label}
        </a>
      ))}
      <p className="text-xs text-ink-600">
        As filtered here, all pages. Cells starting with =, +, − or @ are saved with a leading
        apostrophe, so a spreadsheet shows them as text and never runs them as formulas.
      </p>
    </div>
  );
}
