import type { Permission, Role } from '@lotwise/shared';
import { can } from '@lotwise/shared';
import {
  Bell,
  ClipboardList,
  DatabaseBackup,
  Eye,
  FlaskConical,
  FlaskRound,
  LifeBuoy,
  ListChecks,
  Mail,
  Package,
  PackagePlus,
  ReceiptText,
  ShoppingCart,
  Sun,
  Truck,
  Users,
  type LucideIcon,
} from 'lucide-react';
import { paths } from '../../config/paths';

export interface NavItem {
  label: string;
  to: string;
  /** None: every signed-in person. */
  permission?: Permission;
  /** Active only on its own address, not on the pages below it. */
  end?: boolean;
  icon: LucideIcon;
  /** Not built yet: the page says so and tells what it will do. */
  coming?: boolean;
  /** The group the entry is listed under; none: the main list. */
  section?: 'purchasing' | 'admin' | 'end';
}

export const navItems: readonly NavItem[] = [
  { label: 'Today', to: paths.home, icon: Sun, end: true },
  { label: 'Chemicals', to: paths.chemicals, permission: 'chemicals.read', icon: FlaskConical },
  { label: 'Stock', to: paths.stock, permission: 'stock.read', icon: Package },
  {
    label: 'Preparations',
    to: paths.preparations,
    permission: 'procedures.read',
    icon: ClipboardList,
  },
  // Every role that may read runs (the runs list and a run) finds them here, not only those
  // who record them.
  { label: 'Runs', to: paths.runs, permission: 'procedures.read', icon: FlaskRound },
  {
    label: 'Orders',
    to: paths.orders,
    permission: 'orders.read',
    icon: ShoppingCart,
    section: 'purchasing',
  },
  {
    label: 'Restock',
    to: paths.restock,
    permission: 'orders.read',
    icon: PackagePlus,
    section: 'purchasing',
  },
  {
    label: 'My purchases',
    to: paths.purchases,
    permission: 'orders.join',
    icon: ReceiptText,
    section: 'purchasing',
  },
  { label: 'Alerts', to: paths.alerts, permission: 'alerts.read', icon: Bell },
  {
    label: 'Suppliers',
    to: paths.suppliers,
    permission: 'orders.read',
    icon: Truck,
    section: 'purchasing',
  },
  {
    label: 'People',
    to: paths.adminUsers,
    permission: 'users.manage',
    icon: Users,
    section: 'admin',
  },
  {
    label: 'Outbox',
    to: paths.adminOutbox,
    permission: 'outbox.manage',
    icon: Mail,
    section: 'admin',
  },
  {
    label: 'Watched chemicals',
    to: paths.adminWatchedChemicals,
    permission: 'users.manage',
    icon: Eye,
    section: 'admin',
  },
  {
    label: 'Watch lists',
    to: paths.adminWatchLists,
    permission: 'users.manage',
    icon: ListChecks,
    section: 'admin',
  },
  {
    label: 'Backups',
    to: paths.adminBackups,
    permission: 'backups.manage',
    icon: DatabaseBackup,
    section: 'admin',
  },
  { label: 'Help', to: paths.help, icon: LifeBuoy, section: 'end' },
];

/** The navigation a role sees: only what it may use. */
export function navItemsFor(role: Role): NavItem[] {
  return navItems.filter((item) => !item.permission || can(role, item.permission));
}

function isUnder(pathname: string, to: string): boolean {
  return pathname === to || pathname.startsWith(`${to}/`);
}

/**
 * The one entry a page belongs to: the entry whose place holds the page most closely, so Runs
 * (under Preparations) and Restock (under Orders) are current on their own pages, not their
 * parents as well.
 */
export function currentNavItem(items: readonly NavItem[], pathname: string): NavItem | undefined {
  let current: NavItem | undefined;
  for (const item of items) {
    if (isUnder(pathname, item.to) && (!current || item.to.length > current.to.length)) {
      current = item;
    }
  }
  return current;
}
