import {
  allocateHolds,
  parseSort,
  type ContainerStatus,
  type GhsCode,
  type PlanListQuery,
  type StockUnit,
} from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { lockForWrite } from '../../db/postgres';
import { fromMicro } from '../../db/quantities';
import { parseJsonList } from '../alerts/alerts.repository';
import type { LapsingReservation } from '../alerts/rules';
import { PlanEntity, type PlanRow } from './plan.entity';
import { ReservationEntity, type ReleaseReason, type ReservationRow } from './reservation.entity';

export type PlanValues = Omit<PlanRow, 'id' | 'procedure' | 'createdBy'>;
export type ReservationValues = Omit<ReservationRow, 'id' | 'plan' | 'container' | 'createdBy'>;

/** A container that may be counted in a stock check. */
export interface StockRow {
  id: number;
  labelCode: string;
  lotId: number;
  chemicalId: number;
  locationId: number;
  locationPath: string;
  status: ContainerStatus;
  quantity: number;
  unit: StockUnit;
  expiresOn: string | null;
  /** The lot's purity, or the chemical's default. */
  purityPercent: number;
}

/** A reservation with what the plan and the stock check show of its container. */
export interface ReservationView extends ReservationRow {
  labelCode: string;
  /** What the container holds now. */
  containerQuantity: number;
  chemicalId: number;
  chemicalName: string;
  locationPath: string;
}

/** An active reservation in force, with the plan it holds for. */
export interface HoldRow {
  id: number;
  planId: number;
  containerId: number;
  quantity: number;
  unit: StockUnit;
  until: string;
  plannedOn: string;
  planTitle: string;
}

const sortColumns: Record<string, string> = {
  plannedOn: 'p.planned_on',
  updatedAt: 'p.updated_at',
};

/** Data access for `prep_plans` and `reservations`; answers plain objects. */
export function plansRepository(manager: EntityManager) {
  const repo = manager.getRepository(PlanEntity);
  const reservations = manager.getRepository(ReservationEntity);

  function reservationView() {
    return manager
      .createQueryBuilder()
      .select('r.id', 'id')
      .addSelect('r.plan_id', 'planId')
      .addSelect('r.container_id', 'containerId')
      .addSelect('r.requirement_index', 'requirementIndex')
      .addSelect('r.quantity_micro', 'quantity')
      .addSelect('r.unit', 'unit')
      .addSelect('r.until', 'until')
      .addSelect('r.status', 'status')
      .addSelect('r.released_reason', 'releasedReason')
      .addSelect('r.released_at', 'releasedAt')
      .addSelect('r.created_by_id', 'createdById')
      .addSelect('r.created_at', 'createdAt')
      .addSelect('c.label_code', 'labelCode')
      .addSelect('c.quantity_micro', 'containerQuantity')
      .addSelect('c.chemical_id', 'chemicalId')
      .addSelect('ch.name', 'chemicalName')
      .addSelect('loc.path', 'locationPath')
      .from('reservations', 'r')
      .innerJoin('containers', 'c', 'c.id = r.container_id')
      .innerJoin('chemicals', 'ch', 'ch.id = c.chemical_id')
      .innerJoin('locations', 'loc', 'loc.id = c.location_id');
  }
  const toReservation = (raw: Record<string, unknown>): ReservationView => ({
    ...(raw as unknown as ReservationView),
    id: Number(raw.id),
    planId: Number(raw.planId),
    containerId: Number(raw.containerId),
    chemicalId: Number(raw.chemicalId),
    quantity: fromMicro(raw.quantity),
    containerQuantity: fromMicro(raw.containerQuantity),
    requirementIndex:
      raw.requirementIndex === null || raw.requirementIndex === undefined
        ? null
        : Number(raw.requirementIndex),
    createdById:
      raw.createdById === null || raw.createdById === undefined ? null : Number(raw.createdById),
  });

  return {
    /** In a transaction on PostgreSQL the plan stays locked until it ends (reserve, cancel, record). */
    async findRow(id: number): Promise<PlanRow | null> {
      return repo.findOne({ where: { id }, ...lockForWrite(manager) });
    },
    async insert(values: PlanValues): Promise<number> {
      const result = await repo.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async update(id: number, changes: Partial<PlanValues>): Promise<void> {
      await repo.update({ id }, changes);
    },
    async list(
      query: PlanListQuery,
      createdById: number | null,
    ): Promise<{ rows: PlanRow[]; total: number }> {
      const qb = repo.createQueryBuilder('p');
      if (query.status) qb.andWhere('p.status = :status', { status: query.status });
      if (query.procedureId) {
        qb.andWhere('p.procedure_id = :procedureId', { procedureId: query.procedureId });
      }
      if (createdById !== null) qb.andWhere('p.created_by_id = :createdById', { createdById });
      if (query.q) {
        qb.andWhere(
          "p.procedure_id IN (SELECT qp.id FROM procedures qp WHERE LOWER(qp.title) LIKE :q ESCAPE '\\')",
          { q: `%${query.q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%` },
        );
      }
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const rows = await qb
        .orderBy(
          sortColumns[field] ?? sortColumns.plannedOn!,
          direction === 'desc' ? 'DESC' : 'ASC',
        )
        .addOrderBy('p.id', direction === 'desc' ? 'DESC' : 'ASC')
        .skip((query.page - 1) * query.pageSize)
        .take(query.pageSize)
        .getMany();
      return { rows, total };
    },

    /** Usable containers (sealed or open, something left, not expired before `asOf`). */
    async usableContainers(chemicalIds: number[], asOf: string): Promise<StockRow[]> {
      if (chemicalIds.length === 0) return [];
      const rows = await manager
        .createQueryBuilder()
        .select('c.id', 'id')
        .addSelect('c.label_code', 'labelCode')
        .addSelect('c.lot_id', 'lotId')
        .addSelect('c.chemical_id', 'chemicalId')
        .addSelect('c.location_id', 'locationId')
        .addSelect('loc.path', 'locationPath')
        .addSelect('c.status', 'status')
        .addSelect('c.quantity_micro', 'quantity')
        .addSelect('c.unit', 'unit')
        .addSelect('c.expires_on', 'expiresOn')
        .addSelect('COALESCE(l.purity_percent, ch.default_purity_percent)', 'purityPercent')
        .from('containers', 'c')
        .innerJoin('lots', 'l', 'l.id = c.lot_id')
        .innerJoin('chemicals', 'ch', 'ch.id = c.chemical_id')
        .innerJoin('locations', 'loc', 'loc.id = c.location_id')
        .where('c.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .andWhere("c.status IN ('sealed', 'open') AND c.quantity_micro > 0")
        .andWhere('(c.expires_on IS NULL OR c.expires_on >= :asOf)', { asOf })
        .orderBy('c.id', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return rows.map((raw) => ({
        ...(raw as unknown as StockRow),
        id: Number(raw.id),
        lotId: Number(raw.lotId),
        chemicalId: Number(raw.chemicalId),
        locationId: Number(raw.locationId),
        quantity: fromMicro(raw.quantity),
        purityPercent: Number(raw.purityPercent),
      }));
    },

    /** Active reservations on these containers still in force on `today`. */
    async activeOn(containerIds: number[], today: string): Promise<ReservationRow[]> {
      if (containerIds.length === 0) return [];
      return reservations
        .createQueryBuilder('r')
        .where('r.container_id IN (:...containerIds)', { containerIds })
        .andWhere("r.status = 'active' AND r.until >= :today", { today })
        .getMany();
    },
    /** Reservations in force on `today` on these containers, with their plan, oldest first. */
    async holdsOn(containerIds: number[], today: string): Promise<HoldRow[]> {
      if (containerIds.length === 0) return [];
      const rows = await manager
        .createQueryBuilder()
        .select('r.id', 'id')
        .addSelect('r.plan_id', 'planId')
        .addSelect('r.container_id', 'containerId')
        .addSelect('r.quantity_micro', 'quantity')
        .addSelect('r.unit', 'unit')
        .addSelect('r.until', 'until')
        .addSelect('p.planned_on', 'plannedOn')
        .addSelect('pr.title', 'planTitle')
        .from('reservations', 'r')
        .innerJoin('prep_plans', 'p', 'p.id = r.plan_id')
        .innerJoin('procedures', 'pr', 'pr.id = p.procedure_id')
        .where('r.container_id IN (:...containerIds)', { containerIds })
        .andWhere("r.status = 'active' AND r.until >= :today", { today })
        .orderBy('r.id', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return rows.map((raw) => ({
        id: Number(raw.id),
        planId: Number(raw.planId),
        containerId: Number(raw.containerId),
        quantity: fromMicro(raw.quantity),
        unit: raw.unit as StockUnit,
        until: String(raw.until),
        plannedOn: String(raw.plannedOn),
        planTitle: String(raw.planTitle),
      }));
    },
    async reservationsOf(planId: number): Promise<ReservationView[]> {
      const rows = await reservationView()
        .where('r.plan_id = :planId', { planId })
        .orderBy('r.id', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return rows.map(toReservation);
    },
    /** The reservations of every plan of `planIds`, in one statement. */
    async reservationsOfPlans(planIds: number[]): Promise<ReservationView[]> {
      if (planIds.length === 0) return [];
      const rows = await reservationView()
        .where('r.plan_id IN (:...planIds)', { planIds: [...new Set(planIds)] })
        .orderBy('r.id', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return rows.map(toReservation);
    },
    async insertReservation(values: ReservationValues): Promise<number> {
      const result = await reservations.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    /** Releases a plan's active reservations. */
    async release(planId: number, reason: ReleaseReason, now: string): Promise<void> {
      await reservations.update(
        { planId, status: 'active' },
        { status: 'released', releasedReason: reason, releasedAt: now },
      );
    },
    /**
     * Active reservations still in force on `today` whose until-date (held to the end of that
     * day, UTC) falls on or before `cutoffDay`: the alert rule warns their owners.
     */
    async lapsingBetween(
      today: string,
      cutoffDay: string,
      chemicalIds?: number[],
    ): Promise<LapsingReservation[]> {
      const query = reservationView()
        .addSelect('pr.title', 'planTitle')
        .addSelect('p.created_by_id', 'userId')
        .addSelect('ch.ghs_pictograms', 'ghsPictograms')
        .addSelect('ch.hazard_statements', 'hazardStatements')
        .innerJoin('prep_plans', 'p', 'p.id = r.plan_id')
        .innerJoin('procedures', 'pr', 'pr.id = p.procedure_id')
        .where("r.status = 'active' AND r.until >= :today AND r.until <= :cutoffDay", {
          today,
          cutoffDay,
        })
        .orderBy('r.until', 'ASC')
        .addOrderBy('r.id', 'ASC');
      if (chemicalIds) {
        if (chemicalIds.length === 0) return [];
        query.andWhere('c.chemical_id IN (:...chemicalIds)', { chemicalIds });
      }
      const rows = await query.getRawMany<Record<string, unknown>>();
      // What each reservation still holds: draws since it was made shrink it (allocateHolds).
      const containerIds = [...new Set(rows.map((raw) => Number(raw.containerId)))];
      const inForce =
        containerIds.length === 0
          ? []
          : (
              await reservationView()
                .where('r.container_id IN (:...containerIds)', { containerIds })
                .andWhere("r.status = 'active' AND r.until >= :today", { today })
                .getRawMany<Record<string, unknown>>()
            ).map(toReservation);
      const heldNow = new Map<number, number>();
      for (const containerId of containerIds) {
        const claims = inForce.filter((r) => r.containerId === containerId);
        const quantity = claims[0]?.containerQuantity ?? 0;
        for (const [id, held] of allocateHolds(quantity, claims)) heldNow.set(id, held);
      }
      return rows.map((raw) => {
        const view = toReservation(raw);
        return {
          id: view.id,
          planId: view.planId,
          planTitle: String(raw.planTitle),
          userId: raw.userId === null || raw.userId === undefined ? null : Number(raw.userId),
          containerId: view.containerId,
          labelCode: view.labelCode,
          locationPath: view.locationPath,
          chemicalId: view.chemicalId,
          chemicalName: view.chemicalName,
          ghsPictograms: parseJsonList<GhsCode>(raw.ghsPictograms),
          hazardStatements: parseJsonList<string>(raw.hazardStatements),
          quantity: heldNow.get(view.id) ?? view.quantity,
          unit: view.unit as LapsingReservation['unit'],
          lapsesAt: `${view.until}T23:59:59.999Z`,
        };
      });
    },
    /** Reserved plans none of whose active reservations is still in force on `today`. */
    async lapsedPlanIds(today: string): Promise<number[]> {
      const rows = await manager
        .createQueryBuilder()
        .select('p.id', 'id')
        .from('prep_plans', 'p')
        .where("p.status = 'reserved'")
        .andWhere(
          "NOT EXISTS (SELECT 1 FROM reservations r WHERE r.plan_id = p.id AND r.status = 'active' AND r.until >= :today)",
          { today },
        )
        .getRawMany<{ id: number }>();
      return rows.map((row) => Number(row.id));
    },
  };
}
export type PlansRepository = ReturnType<typeof plansRepository>;
