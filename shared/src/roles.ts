/**
 * Roles and the permission matrix. The server enforces it on every route; the web app
 * uses the same matrix to show only what a role may use.
 */
export const roles = ['admin', 'manager', 'member', 'viewer'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  admin: 'Admin',
  manager: 'Manager',
  member: 'Member',
  viewer: 'Viewer',
};

export const roleDescriptions: Record<Role, string> = {
  admin: 'Everything, including users, roles and settings',
  manager: 'Stock, procedures, suppliers and orders; approves restricted items',
  member: 'Sees stock, plans and records own runs, joins shared orders',
  viewer: 'Read-only: stock, locations, hazards, procedures',
};

export const permissions = [
  'chemicals.read',
  'chemicals.write',
  'stock.read',
  'stock.write',
  /** Record draws (use) from a container; adjusting, splitting and moving need stock.write. */
  'stock.draw',
  'procedures.read',
  'procedures.write',
  'runs.record',
  /** Change anyone's prep plans and runs (runs.record alone: only one's own). */
  'plans.manage',
  'orders.read',
  'orders.join',
  'orders.manage',
  'alerts.read',
  'users.manage',
  'outbox.manage',
  /** Run maintenance checks such as the ledger invariant. */
  'maintenance.run',
] as const;
export type Permission = (typeof permissions)[number];

const everything: readonly Permission[] = permissions;

export const permissionMatrix: Record<Role, readonly Permission[]> = {
  admin: everything,
  manager: [
    'chemicals.read',
    'chemicals.write',
    'stock.read',
    'stock.write',
    'stock.draw',
    'procedures.read',
    'procedures.write',
    'runs.record',
    'plans.manage',
    'orders.read',
    'orders.join',
    'orders.manage',
    'alerts.read',
  ],
  member: [
    'chemicals.read',
    'stock.read',
    'stock.draw',
    'procedures.read',
    'runs.record',
    'orders.read',
    'orders.join',
    'alerts.read',
  ],
  viewer: ['chemicals.read', 'stock.read', 'procedures.read'],
};

/** True when `role` holds `permission`. */
export function can(role: Role, permission: Permission): boolean {
  return permissionMatrix[role].includes(permission);
}
