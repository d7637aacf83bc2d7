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
        end={item.end}
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

function Group({ title, items }: { title: string; items: NavItem[] }) {
  if (items.length === 0) return null;
  return (
    <div>
      <p className="mb-1 px-2.5 text-xs font-semibold tracking-wide text-ink-600 uppercase">
        {title}
      </p>
      <ul className="flex flex-col gap-0.5">
        {items.map((item) => (
          <Item key={item.to} item={item} />
        ))}
      </ul>
    </div>
  );
}

export function SideNav({ role }: { role: Role }) {
  const items = navItemsFor(role);
  const main = items.filter((item) => item.section === undefined);
  return (
    <nav aria-label="Main" className="flex flex-col gap-5 px-3 py-4">
      <ul className="flex flex-col gap-0.5">
        {main.map((item) => (
          <Item key={item.to} item={item} />
        ))}
      </ul>
      <Group title="Purchasing" items={items.filter((item) => item.section === 'purchasing')} />
      <Group title="Admin" items={items.filter((item) => item.section === 'admin')} />
      <ul className="flex flex-col gap-0.5 border-t border-ink-100 pt-3">
        {items
          .filter((item) => item.section === 'end')
          .map((item) => (
            <Item key={item.to} item={item} />
          ))}
      </ul>
    </nav>
  );
}
