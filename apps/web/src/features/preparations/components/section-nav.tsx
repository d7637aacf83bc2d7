import { NavLink, Outlet } from 'react-router';
import { ClipboardList, FlaskRound, NotebookPen, type LucideIcon } from 'lucide-react';
import { paths } from '../../../config/paths';
import { cn } from '../../../lib/cn';

const sections: { to: string; label: string; icon: LucideIcon }[] = [
  { to: paths.procedures, label: 'Procedures', icon: NotebookPen },
  { to: paths.plans, label: 'Session plans', icon: ClipboardList },
  { to: paths.runs, label: 'Runs', icon: FlaskRound },
];

export function PreparationsSectionNav() {
  return (
    <nav aria-label="Preparations" className="-mt-2 mb-5 border-b border-ink-200 print:hidden">
      <ul className="flex flex-wrap gap-1">
        {sections.map(({ to, label, icon: Icon }) => (
          <li key={to}>
            <NavLink
              to={to}
              className={({ isActive }) =>
                cn(
                  '-mb-px flex items-center gap-1.5 border-b-2 px-3 py-2 text-sm',
                  isActive
                    ? 'border-accent-600 font-semibold text-accent-800'
                    : 'border-transparent text-ink-700 hover:border-ink-300 hover:text-ink-900',
                )
              }
            >
              <Icon aria-hidden="true" className="size-4" />
              {label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

/** Every preparations page sits under the section's own navigation. */
export function PreparationsLayout() {
  return (
    <>
      <PreparationsSectionNav />
      <Outlet />
    </>
  );
}
