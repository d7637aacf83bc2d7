import type { WatchListing } from '@lotwise/shared';
import { watchListingText } from '@lotwise/shared';
import { Eye } from 'lucide-react';
import { Badge } from '../ui/badge';

/** One listing per list (a chemical is named once per list, whatever rows it meets). */
function byList(listings: readonly WatchListing[]): WatchListing[] {
  const seen = new Set<number>();
  return listings.filter((listing) => !seen.has(listing.listId) && seen.add(listing.listId));
}

/**
 * Compact badges naming the watch lists a chemical is on, for tables: the action required is
 * the badge's description (read by screen readers, shown as a tooltip).
 */
export function WatchListBadges({ listings }: { listings: readonly WatchListing[] | undefined }) {
  if (!listings || listings.length === 0) return null;
  return (
    <span className="inline-flex flex-wrap gap-1">
      {byList(listings).map((listing) => (
        <span key={listing.listId} title={watchListingText(listing)} data-testid="watch-badge">
          <Badge tone="warn" icon={<Eye aria-hidden="true" />} className="whitespace-normal">
            Watched: {listing.listName}
          </Badge>
          <span className="sr-only"> {watchListingText(listing)}</span>
        </span>
      ))}
    </span>
  );
}

/** The watch lists a chemical is on, written out, for the hazards of a chemical or container. */
export function WatchListPanel({ listings }: { listings: readonly WatchListing[] | undefined }) {
  if (!listings || listings.length === 0) return null;
  return (
    <div data-testid="watch-panel">
      <h3 className="mb-1.5 flex items-center gap-1.5 text-sm font-semibold text-ink-800">
        <Eye aria-hidden="true" className="size-4 text-warn-700" />
        On the lab’s watch lists
      </h3>
      <ul className="flex flex-col gap-2 text-sm text-ink-800">
        {listings.map((listing) => (
          <li key={`${listing.listId}-${listing.substance}`}>
            <Badge tone="warn" icon={<Eye aria-hidden="true" />}>
              Watched: {listing.listName}
            </Badge>{' '}
            <span className="text-ink-700">
              {listing.substance}, {listing.threshold}.
            </span>{' '}
            {listing.action} <span className="text-xs text-ink-600">Source: {listing.source}.</span>
          </li>
        ))}
      </ul>
      <p className="mt-1.5 text-xs text-ink-600">
        Receiving or drawing it asks why; orders of it need a manager’s approval. The regulation’s
        current text and your authority decide.
      </p>
    </div>
  );
}
