import { Link } from 'react-router';
import { ShieldAlert } from 'lucide-react';
import { storageGroups, type SegregationWarning } from '@lotwise/shared';
import { paths } from '../../../config/paths';

/**
 * Storage warnings for a place. They never block anything, and their absence is not a
 * safety approval — the SDS and local rules decide.
 */
export function SegregationWarnings({
  warnings,
  title = 'Storage warnings',
}: {
  warnings: readonly SegregationWarning[];
  title?: string;
}) {
  if (warnings.length === 0) return null;
  return (
    <div
      role="status"
      className="rounded-md border border-warn-200 bg-warn-50 px-3 py-2.5 text-sm text-warn-700"
    >
      <p className="flex items-center gap-2 font-semibold">
        <ShieldAlert aria-hidden="true" className="size-4 shrink-0" />
        {title}
      </p>
      <ul className="mt-1.5 flex flex-col gap-2 text-ink-800">
        {warnings.map((warning, index) => (
          <li key={`${warning.code}-${index}`} className="pl-6">
            <p>{warning.message}</p>
            <p className="text-xs text-ink-700">
              {warning.groups.map((group) => storageGroups[group].label).join(' and ')}
              {warning.groups.length > 0 && ': '}
              {warning.reason}
              {warning.source && <> (source: {warning.source})</>}
            </p>
            {warning.labelCodes.length > 0 && (
              <p className="text-xs">
                Involved:{' '}
                {warning.labelCodes.map((code, i) => (
                  <span key={code}>
                    {i > 0 && ', '}
                    <Link
                      to={paths.stockContainerByLabel(code)}
                      className="font-mono text-accent-700 underline underline-offset-2"
                    >
                      {code}
                    </Link>
                  </span>
                ))}
              </p>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
