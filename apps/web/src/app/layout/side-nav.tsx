import { NavLink } from 'react-router';
import type { Role } from '@lotwise/shared';
import { cn } from '../../lib/cn';
import { navItemsFor, type NavItem } from './nav-items';

function Item({ item }: { item: NavItem }) {
  const Icon = item.icon;
  return (
    <li>
      <NavLink
        to={item.to}
        className={({ isActive }) =>
          cn(
            'flex items-center gap-2.5 rounded-md px-2.5 py-1.5 text-sm transition-colors',
            isActive
              ? 'bg-accent-50 font-semibold text-accent-800'
              : 'text-ink-700 hover:bg-ink-100 hover:text-ink-900',
          )
        }
      >
        <Icon aria-hidden="true" className="size-4 shrink-0" />
        <span className="flex-1">{item.label}</span>
        {item.coming && (
          <span className="rounded border border-ink-200 px-1 text-[0.7rem] font-normal text-ink-600">
            coming
          </span>
        )}
      </NavLink>
    </li>
  );
}

export function SideNav({ role }: { role: Role }) {
  const items = navItemsFor(role);
  const main = items.filter((item) => item.section === undefined);
  const purchasing = items.filter((item) => item.section === 'purchasing');
  const admin = items.filter((item) => item.section === 'admin');
  return (
    <nav aria-label="Main" className="flex flex-col gap-5 px-3 py-4">
      <ul className="flex flex-col gap-0.5">
        {main.map((item) => (
          <Item key={item.to} item={item} />
        ))}
      </ul>
      {purchasing.length > 0 && (
        <div>
          <p className="mb-1 px-2.5 text-xs font-semibold tracking-wide text-ink-600 uppercase">
            Purchasing
          </p>
          <ul className="flex flex-col gap-0.5">
            {purchasing.map((item) => (
              <Item key={item.to} item={item} />
            ))}
          </ul>
        </div>
      )}
      {admin.length > 0 && (
        <div>
          <p className="mb-1 px-2.5 text-xs font-semibold tracking-wide text-ink-600 uppercase">
            Admin
          </p>
          <ul className="flex flex-col gap-0.5">
            {admin.map((item) => (
              <Item key={item.to} item={item} />
            ))}
          </ul>
        </div>
      )}
    </nav>
  );
}
