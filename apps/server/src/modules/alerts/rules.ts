import { createHash } from 'node:crypto';
import { reorderState } from '@lotwise/chem';
import type { AlertKind, AlertSeverity, GhsCode, StockUnit } from '@lotwise/shared';
import type { AlertContainerFacts, LowStockFacts } from './alerts.repository';

/** A chemical the condition is about. */
export interface ConditionChemical {
  id: number;
  name: string;
  ghsPictograms: GhsCode[];
  /** H-statement codes as recorded ("H225"); their texts are added when a message is written. */
  hazardStatements: string[];
}

/** One current condition found by a rule. Pure data: the rules read nothing themselves. */
export interface Condition {
  kind: AlertKind;
  severity: AlertSeverity;
  /** Stable for the same condition, e.g. `expired:container:7`. */
  key: string;
  chemical: ConditionChemical;
  /** The container it is about; null for a chemical-wide condition (low stock). */
  container: AlertContainerFacts | null;
  dueOn: string | null;
  /** Low stock: the usable total against the reorder point, and the containers left. */
  stock?: {
    total: number;
    unit: StockUnit;
    reorderPoint: number;
    reorderQuantity: number | null;
    containers: AlertContainerFacts[];
  };
  /** A reservation about to lapse. */
  reservation?: LapsingReservation;
  /** Only these people hear about it (e.g. whoever made the reservation). */
  userIds?: number[];
}

/**
 * A reservation of stock for a prep plan that lapses soon. The plans module provides these
 * through `ReservationSource`; until it exists no reservation rule runs.
 */
export interface LapsingReservation {
  id: number;
  planId: number;
  planTitle: string;
  userId: number | null;
  containerId: number;
  labelCode: string;
  locationPath: string;
  chemicalId: number;
  chemicalName: string;
  ghsPictograms: GhsCode[];
  hazardStatements: string[];
  quantity: number;
  unit: StockUnit;
  /** ISO-8601 time the reservation stops holding the stock. */
  lapsesAt: string;
}

/** Where the reservation rule reads lapsing reservations from (the plans module). */
export interface ReservationSource {
  lapsingBefore(cutoff: string, chemicalIds?: number[]): Promise<LapsingReservation[]>;
}

/** Chemicals at or below their reorder point; out of stock entirely is critical. */
export function lowStockConditions(
  chemicals: LowStockFacts[],
  usable: AlertContainerFacts[],
): Condition[] {
  const conditions: Condition[] = [];
  for (const chemical of chemicals) {
    const state = reorderState(chemical.total, chemical.reorderPoint);
    if (state !== 'below' && state !== 'at') continue;
    const severity: AlertSeverity = chemical.total <= 1e-9 ? 'critical' : 'warning';
    conditions.push({
      kind: 'low-stock',
      severity,
      key: `low-stock:chemical:${chemical.id}`,
      chemical: {
        id: chemical.id,
        name: chemical.name,
        ghsPictograms: chemical.ghsPictograms,
        hazardStatements: chemical.hazardStatements,
      },
      container: null,
      dueOn: null,
      stock: {
        total: chemical.total,
        unit: chemical.stockUnit,
        reorderPoint: chemical.reorderPoint,
        reorderQuantity: chemical.reorderQuantity,
        containers: usable.filter((c) => c.chemicalId === chemical.id),
      },
    });
  }
  return conditions;
}

/**
 * Sealed or open containers past their expiry (expired), expiring on or before `until`
 * (expiring), and peroxide formers whose test-or-discard date is on or before `until`
 * (peroxide-due; critical once the date has passed).
 */
export function datedConditions(
  containers: AlertContainerFacts[],
  today: string,
  until: string,
): Condition[] {
  const conditions: Condition[] = [];
  for (const container of containers) {
    if (container.status !== 'sealed' && container.status !== 'open') continue;
    const chemical = {
      id: container.chemicalId,
      name: container.chemicalName,
      ghsPictograms: container.ghsPictograms,
      hazardStatements: container.hazardStatements,
    };
    if (container.expiresOn !== null && container.expiresOn <= until) {
      const expired = container.expiresOn < today;
      conditions.push({
        kind: expired ? 'expired' : 'expiring',
        severity: expired ? 'warning' : 'info',
        key: `${expired ? 'expired' : 'expiring'}:container:${container.id}`,
        chemical,
        container,
        dueOn: container.expiresOn,
      });
    }
    if (container.peroxideDueOn !== null && container.peroxideDueOn <= until) {
      conditions.push({
        kind: 'peroxide-due',
        severity: container.peroxideDueOn < today ? 'critical' : 'warning',
        key: `peroxide-due:container:${container.id}`,
        chemical,
        container,
        dueOn: container.peroxideDueOn,
      });
    }
  }
  return conditions;
}

/** Reservations lapsing before the cutoff; only the person who reserved hears about it. */
export function reservationConditions(reservations: LapsingReservation[]): Condition[] {
  return reservations.map((reservation) => ({
    kind: 'reservation-lapsing' as const,
    severity: 'info' as const,
    key: `reservation-lapsing:reservation:${reservation.id}`,
    chemical: {
      id: reservation.chemicalId,
      name: reservation.chemicalName,
      ghsPictograms: reservation.ghsPictograms,
      hazardStatements: reservation.hazardStatements,
    },
    container: null,
    dueOn: reservation.lapsesAt.slice(0, 10),
    reservation,
    ...(reservation.userId === null ? {} : { userIds: [reservation.userId] }),
  }));
}

const severityRank: Record<AlertSeverity, number> = { critical: 0, warning: 1, info: 2 };

/** Most severe first, then the soonest date, then by chemical name. */
export function sortConditions(conditions: Condition[]): Condition[] {
  return [...conditions].sort(
    (a, b) =>
      severityRank[a.severity] - severityRank[b.severity] ||
      (a.dueOn ?? '9999').localeCompare(b.dueOn ?? '9999') ||
      a.chemical.name.localeCompare(b.chemical.name) ||
      a.key.localeCompare(b.key),
  );
}

/** What one e-mail is about: conditions of one kind for one chemical. */
export interface MailTopic {
  kind: AlertKind;
  severity: AlertSeverity;
  chemical: ConditionChemical;
  conditions: Condition[];
  /**
   * The same key mails a person once per window. It changes when the situation does: a new
   * container in the group, or a worse severity (low -> out of stock, due -> overdue).
   */
  dedupKey: string;
  userIds?: number[];
}

/** Groups conditions into e-mails: one per kind and chemical (and per reservation). */
export function mailTopics(conditions: Condition[]): MailTopic[] {
  const groups = new Map<string, Condition[]>();
  for (const condition of sortConditions(conditions)) {
    const group =
      condition.kind === 'reservation-lapsing'
        ? condition.key
        : `${condition.kind}:chemical:${condition.chemical.id}`;
    if (!groups.has(group)) groups.set(group, []);
    groups.get(group)!.push(condition);
  }
  return [...groups.entries()].map(([group, members]) => {
    const first = members[0]!;
    const severity = members.reduce<AlertSeverity>(
      (worst, c) => (severityRank[c.severity] < severityRank[worst] ? c.severity : worst),
      'info',
    );
    const containerIds = members
      .map((c) => c.container?.id)
      .filter((id): id is number => id !== undefined)
      .sort((a, b) => a - b);
    const fingerprint = containerIds.length
      ? `:${createHash('sha256').update(containerIds.join(',')).digest('hex').slice(0, 12)}`
      : '';
    return {
      kind: first.kind,
      severity,
      chemical: first.chemical,
      conditions: members,
      dedupKey: `${group}:${severity}${fingerprint}`,
      ...(first.userIds ? { userIds: first.userIds } : {}),
    };
  });
}
