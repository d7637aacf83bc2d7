import { Link, useLocation } from 'react-router';
import type { Role } from '@lotwise/shared';
import { cn } from '../../lib/cn';
import { currentNavItem, navItemsFor, type NavItem } from './nav-items';

function Item({ item, current }: { item: NavItem; current: NavItem | undefined }) {
  const Icon = item.icon;
  const isCurrent = item === current;
  return (
    <li>
      <Link
        to={item.to}
        aria-current={isCurrent ? 'page' : undefined}
        className={cn(
          'flex items-center gap-2.5 rounded-md px-2.5 py-1.5 text-sm transition-colors pointer-coarse:min-h-11',
          isCurrent
            ? 'bg-accent-50 font-semibold text-accent-800'
            : 'text-ink-700 hover:bg-ink-100 hover:text-ink-900',
        )}
      >
        <Icon aria-hidden="true" className="size-4 shrink-0" />
        <span className="flex-1">{item.label}</span>
        {item.coming && (
          <span className="rounded border border-ink-200 px-1 text-[0.7rem] font-normal text-ink-600">
            coming
          </span>
        )}
      </Link>
    </li>
  );
}

function Group({
  title,
  items,
  current,
}: {
  title: string;
  items: NavItem[];
  current: NavItem | undefined;
}) {
  if (items.length === 0) return null;
  return (
    <div>
      <p className="mb-1 px-2.5 text-xs font-semibold tracking-wide text-ink-600 uppercase">
        {title}
      </p>
      <ul className="flex flex-col gap-0.5">
        {items.map((item) => (
          <Item key={item.to} item={item} current={current} />
        ))}
      </ul>
    </div>
  );
}

/** The app's places a role may use; exactly one entry is current on any page below them. */
export function SideNav({ role }: { role: Role }) {
  const items = navItemsFor(role);
  const current = currentNavItem(items, useLocation().pathname);
  const main = items.filter((item) => item.section === undefined);
  return (
    <nav aria-label="Main" className="flex flex-col gap-5 px-3 py-4">
      <ul className="flex flex-col gap-0.5">
        {main.map((item) => (
          <Item key={item.to} item={item} current={current} />
        ))}
      </ul>
      <Group
        title="Purchasing"
        items={items.filter((item) => item.section === 'purchasing')}
        current={current}
      />
      <Group
        title="Admin"
        items={items.filter((item) => item.section === 'admin')}
        current={current}
      />
      <ul className="flex flex-col gap-0.5 border-t border-ink-100 pt-3">
        {items
          .filter((item) => item.section === 'end')
          .map((item) => (
            <Item key={item.to} item={item} current={current} />
          ))}
      </ul>
    </nav>
  );
}
