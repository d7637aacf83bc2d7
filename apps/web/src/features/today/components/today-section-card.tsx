import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { ArrowRight, CircleAlert, CircleCheck, Info, TriangleAlert } from 'lucide-react';
import type { TodayItem, TodaySection } from '@lotwise/shared';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { formatCount } from '../../../lib/format';

const severityLook: Record<TodayItem['severity'], { tone: BadgeTone; icon: ReactNode }> = {
  critical: { tone: 'danger', icon: <CircleAlert aria-hidden="true" /> },
  warning: { tone: 'warn', icon: <TriangleAlert aria-hidden="true" /> },
  info: { tone: 'neutral', icon: <Info aria-hidden="true" /> },
};

function TodayItemRow({ item }: { item: TodayItem }) {
  const look = severityLook[item.severity];
  return (
    <li className="flex flex-col gap-1.5 px-4 py-3">
      <div className="flex flex-wrap items-start justify-between gap-x-3 gap-y-1">
        <Link
          to={item.link}
          className="min-w-0 font-medium break-words text-ink-900 underline decoration-ink-300 underline-offset-4 hover:decoration-ink-900"
        >
          {item.title}
        </Link>
        <Badge tone={look.tone} icon={look.icon}>
          {item.status}
        </Badge>
      </div>
      <p className="text-sm text-ink-700">{item.detail}</p>
      {item.notes.length > 0 && (
        <ul className="flex flex-col gap-0.5 text-sm text-ink-700">
          {item.notes.map((note) => (
            <li key={note} className="flex gap-1.5">
              <span aria-hidden="true" className="text-ink-400">
                –
              </span>
              <span>{note}</span>
            </li>
          ))}
        </ul>
      )}
      {item.chemicals.length > 0 && (
        <ul
          aria-label={`Hazards: ${item.chemicals.map((c) => c.name).join(', ')}`}
          className="flex flex-col gap-1"
        >
          {item.chemicals.map((chemical) => (
            <li key={chemical.id} className="flex flex-wrap items-center gap-x-2 gap-y-1">
              {/* The name is said once: not again when it is the item's title. */}
              {chemical.name !== item.title && (
                <span className="text-xs font-medium text-ink-700">{chemical.name}</span>
              )}
              <PictogramList codes={chemical.ghsPictograms} />
            </li>
          ))}
        </ul>
      )}
    </li>
  );
}

/**
 * One section of the start page: its first items, each a link to where to act; an empty
 * section says all is well; "and N more" opens the full list.
 */
export function TodaySectionCard({
  id,
  title,
  icon,
  section,
  allWell,
  moreLabel,
}: {
  id: string;
  title: string;
  icon: ReactNode;
  section: TodaySection;
  allWell: string;
  moreLabel: string;
}) {
  const headingId = `today-${id}`;
  const more = section.total - section.items.length;
  return (
    <section
      aria-labelledby={headingId}
      className="mb-4 flex break-inside-avoid flex-col overflow-hidden rounded-lg border border-ink-200 bg-white"
    >
      <header className="flex items-center gap-2 border-b border-ink-100 px-4 py-3">
        <span className="text-accent-700 [&_svg]:size-5">{icon}</span>
        <h2 id={headingId} className="flex-1 font-semibold text-ink-900">
          {title}
        </h2>
        <span className="text-sm text-ink-600 tabular-nums">
          {section.total === 0 ? 'none' : formatCount(section.total)}
        </span>
      </header>
      {section.items.length === 0 ? (
        <p className="flex items-start gap-2 px-4 py-4 text-sm text-ink-700">
          <CircleCheck aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-ok-700" />
          <span>{allWell}</span>
        </p>
      ) : (
        <ul className="flex flex-col divide-y divide-ink-100">
          {section.items.map((item) => (
            <TodayItemRow key={item.key} item={item} />
          ))}
        </ul>
      )}
      <footer className="mt-auto border-t border-ink-100 px-4 py-2 text-sm">
        <Link
          to={section.moreLink}
          className="inline-flex min-h-11 items-center gap-1 font-medium text-accent-800 underline-offset-2 hover:underline"
        >
          {more > 0 ? `and ${formatCount(more)} more` : moreLabel}
          <span className="sr-only"> ({title})</span>
          <ArrowRight aria-hidden="true" className="size-4" />
        </Link>
      </footer>
    </section>
  );
}
