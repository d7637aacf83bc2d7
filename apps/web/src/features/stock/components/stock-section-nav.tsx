import { NavLink, Outlet } from 'react-router';
import {
  Boxes,
  FileUp,
  LayoutList,
  MapPin,
  PackagePlus,
  ShieldAlert,
  Tags,
  type LucideIcon,
} from 'lucide-react';
import { can, type Permission } from '@lotwise/shared';
import { useCurrentUser } from '../../../lib/auth';
import { paths } from '../../../config/paths';
import { cn } from '../../../lib/cn';

interface Section {
  to: string;
  label: string;
  icon: LucideIcon;
  end?: boolean;
  /** Shown only to roles holding it. */
  permission?: Permission;
}

/** The parts of Stock. CSV export sits on the lists it exports. */
const sections: Section[] = [
  { to: paths.stock, label: 'Overview', icon: LayoutList, end: true },
  { to: paths.stockContainers, label: 'Containers', icon: Boxes },
  { to: paths.stockLocations, label: 'Locations', icon: MapPin },
  { to: paths.stockSegregation, label: 'Storage conflicts', icon: ShieldAlert },
  { to: paths.stockReceive, label: 'Receive', icon: PackagePlus, permission: 'stock.write' },
  { to: paths.stockImport, label: 'Import', icon: FileUp, permission: 'stock.write' },
  { to: paths.stockLabels, label: 'Labels', icon: Tags },
];

export function StockSectionNav() {
  const { data: user } = useCurrentUser();
  const visible = sections.filter(
    (section) =>
      section.permission === undefined || (user ? can(user.role, section.permission) : false),
  );
  return (
    <nav aria-label="Stock" className="-mt-2 mb-5 border-b border-ink-200 print:hidden">
      <ul className="flex flex-wrap gap-1">
        {visible.map(({ to, label, icon: Icon, end }) => (
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
