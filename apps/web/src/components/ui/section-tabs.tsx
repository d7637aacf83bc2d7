import { NavLink } from 'react-router';
import type { LucideIcon } from 'lucide-react';
import { cn } from '../../lib/cn';

export interface SectionTab {
  to: string;
  label: string;
  icon: LucideIcon;
  /** Current only on exactly this place, not the places below it. */
  end?: boolean;
}

/**
 * The parts of one section as a row of tabs. On a narrow screen the row scrolls sideways
 * within itself (one line instead of several); with a finger each tab is 44 px high.
 */
export function SectionTabs({ label, tabs }: { label: string; tabs: readonly SectionTab[] }) {
  return (
    <nav aria-label={label} className="-mt-2 mb-5 border-b border-ink-200 print:hidden">
      <ul className="flex gap-1 overflow-x-auto max-sm:-mx-4 max-sm:px-4 sm:flex-wrap">
        {tabs.map(({ to, label: tabLabel, icon: Icon, end }) => (
          <li key={to} className="shrink-0">
            <NavLink
              to={to}
              end={end}
              className={({ isActive }) =>
                cn(
                  '-mb-px flex items-center gap-1.5 border-b-2 px-3 py-2 text-sm whitespace-nowrap pointer-coarse:min-h-11',
                  isActive
                    ? 'border-accent-600 font-semibold text-accent-800'
                    : 'border-transparent text-ink-700 hover:border-ink-300 hover:text-ink-900',
                )
              }
            >
              <Icon aria-hidden="true" className="size-4" />
              {tabLabel}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
