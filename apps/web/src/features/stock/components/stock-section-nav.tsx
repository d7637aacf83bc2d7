import { NavLink, Outlet } from 'react-router';
import { Boxes, LayoutList, MapPin, ShieldAlert, type LucideIcon } from 'lucide-react';
import { paths } from '../../../config/paths';
import { cn } from '../../../lib/cn';

interface Section {
  to: string;
  label: string;
  icon: LucideIcon;
  end?: boolean;
}

/** The parts of Stock. Import, export and labels join this list when they are built. */
const sections: Section[] = [
  { to: paths.stock, label: 'Overview', icon: LayoutList, end: true },
  { to: paths.stockContainers, label: 'Containers', icon: Boxes },
  { to: paths.stockLocations, label: 'Locations', icon: MapPin },
  { to: paths.stockSegregation, label: 'Storage conflicts', icon: ShieldAlert },
];

export function StockSectionNav() {
  return (
    <nav aria-label="Stock" className="-mt-2 mb-5 border-b border-ink-200">
      <ul className="flex flex-wrap gap-1">
        {sections.map(({ to, label, icon: Icon, end }) => (
          <li key={to}>
            <NavLink
              to={to}
              end={end}
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

/** Every stock page sits under the section's own navigation. */
export function StockLayout() {
  return (
    <>
      <StockSectionNav />
      <Outlet />
    </>
  );
}
