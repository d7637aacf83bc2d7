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

/** A role in a sentence: "Robin is now a member", "… an admin". */
export const roleInSentence: Record<Role, string> = {
  admin: 'an admin',
  manager: 'a manager',
  member: 'a member',
  viewer: 'a viewer',
};

export const roleDescriptions: Record<Role, string> = {
  admin: 'Everything, including users, roles, settings and backups',
  manager: 'Stock, procedures, suppliers and orders; approves restricted items',
  member: 'Sees stock, plans sessions, records runs from any plan, joins shared orders',
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
  /**
   * Change or cancel anyone's prep plans and record anyone's runs (runs.record alone: only
   * one's own plans and runs; a run may still be started from anyone's plan).
   */
  'plans.manage',
  'orders.read',
  'orders.join',
  'orders.manage',
  'alerts.read',
  'users.manage',
  'outbox.manage',
  /** Run maintenance checks such as the ledger invariant. */
  'maintenance.run',
  /** List, take and download backups of the whole database (it holds every account). */
  'backups.manage',
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

/** Who is asking, as the ownership rules need it. */
export interface Actor {
  id: number;
  role: Role;
}

/**
 * Editing, reserving for or cancelling a prep plan: its author (with `runs.record`) or anyone
 * with `plans.manage`. In a teaching lab the technician plans and the members run.
 */
export function mayChangePlan(actor: Actor, plan: { authorId: number | null }): boolean {
  if (can(actor.role, 'plans.manage')) return true;
  return can(actor.role, 'runs.record') && plan.authorId !== null && plan.authorId === actor.id;
}

/**
 * Starting a run from a prep plan: anyone with `runs.record` who can see the plan, whoever
 * planned it. The run is the person's own; the plan stays its author's.
 */
export function mayRunFromPlan(actor: Actor): boolean {
  return can(actor.role, 'runs.record');
}

/** Recording a run: the person performing it, or anyone with `plans.manage`. */
export function mayRecordRun(actor: Actor, run: { performerId: number | null }): boolean {
  if (can(actor.role, 'plans.manage')) return true;
  return can(actor.role, 'runs.record') && run.performerId !== null && run.performerId === actor.id;
}
