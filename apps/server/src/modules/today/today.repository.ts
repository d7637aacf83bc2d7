import type { OrderStatus, SharePaymentStatus } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { OrderShareEntity } from '../orders/order-share.entity';
import { PlanEntity, type PlanRow } from '../plans/plan.entity';
import { RunEntity } from '../runs/run.entity';

/** A plan on the start page, with its procedure's title and its author's name. */
export interface TodayPlanRow extends PlanRow {
  procedureTitle: string;
  authorName: string | null;
}

/** An open run of the person, with its procedure's title. */
export interface TodayRunRow {
  id: number;
  procedureId: number;
  procedureTitle: string;
  planId: number | null;
  scaleFactor: number;
  createdAt: string;
}

/** A share of the person in an order that may need them, with the order's state. */
export interface TodayShareRow {
  shareId: number;
  amountMinor: number | null;
  paymentStatus: SharePaymentStatus;
  containerId: number | null;
  orderId: number;
  orderTitle: string;
  orderStatus: OrderStatus;
  claimDeadline: string | null;
  claimsClosedAt: string | null;
  currency: string;
  chemicalId: number;
}

/**
 * The start page's own reads: one statement per list (a count and the first rows), so the
 * page costs the same however many plans, runs or shares there are.
 */
export function todayRepository(manager: EntityManager) {
  return {
    /** Plans not yet run or cancelled, planned from `from` to `to`, soonest first. */
    async plansBetween(
      from: string,
      to: string,
      limit: number,
    ): Promise<{ rows: TodayPlanRow[]; total: number }> {
      const qb = manager
        .getRepository(PlanEntity)
        .createQueryBuilder('p')
        .where("p.status IN ('draft', 'reserved')")
        .andWhere('p.planned_on BETWEEN :from AND :to', { from, to });
      const total = await qb.getCount();
      const raw = await qb
        .clone()
        .leftJoin('procedures', 'pr', 'pr.id = p.procedure_id')
        .leftJoin('users', 'u', 'u.id = p.created_by_id')
        .addSelect('pr.title', 'procedureTitle')
        .addSelect('u.display_name', 'authorName')
        .orderBy('p.planned_on', 'ASC')
        .addOrderBy('p.id', 'ASC')
        .limit(limit)
        .getRawAndEntities();
      const rows = raw.entities.map((entity, index) => {
        const extra = raw.raw[index] as {
          procedureTitle: string | null;
          authorName: string | null;
        };
        return {
          ...entity,
          procedureTitle: extra.procedureTitle ?? `Procedure #${entity.procedureId}`,
          authorName: extra.authorName,
        };
      });
      return { rows, total };
    },

    /** The person's runs still open (not recorded), oldest first. */
    async openRunsOf(
      userId: number,
      limit: number,
    ): Promise<{ rows: TodayRunRow[]; total: number }> {
      const qb = manager
        .getRepository(RunEntity)
        .createQueryBuilder('r')
        .where("r.status = 'open'")
        .andWhere('r.performed_by_id = :userId', { userId });
      const total = await qb.getCount();
      const raw = await qb
        .clone()
        .leftJoin('procedures', 'pr', 'pr.id = r.procedure_id')
        .select('r.id', 'id')
        .addSelect('r.procedure_id', 'procedureId')
        .addSelect('pr.title', 'procedureTitle')
        .addSelect('r.plan_id', 'planId')
        .addSelect('r.scale_factor', 'scaleFactor')
        .addSelect('r.created_at', 'createdAt')
        .orderBy('r.created_at', 'ASC')
        .addOrderBy('r.id', 'ASC')
        .limit(limit)
        .getRawMany<Record<string, unknown>>();
      return {
        total,
        rows: raw.map((row) => ({
          id: Number(row.id),
          procedureId: Number(row.procedureId),
          procedureTitle: (row.procedureTitle as string | null) ?? `Procedure #${row.procedureId}`,
          planId: row.planId === null ? null : Number(row.planId),
          scaleFactor: Number(row.scaleFactor),
          createdAt: String(row.createdAt),
        })),
      };
    },

    /** The person's shares in orders of these statuses, newest order first. */
    async sharesOf(userId: number, statuses: readonly OrderStatus[]): Promise<TodayShareRow[]> {
      const raw = await manager
        .getRepository(OrderShareEntity)
        .createQueryBuilder('s')
        .innerJoin('orders', 'o', 'o.id = s.order_id')
        .innerJoin('order_lines', 'l', 'l.id = s.line_id')
        .select('s.id', 'shareId')
        .addSelect('s.amount_minor', 'amountMinor')
        .addSelect('s.payment_status', 'paymentStatus')
        .addSelect('s.container_id', 'containerId')
        .addSelect('o.id', 'orderId')
        .addSelect('o.title', 'orderTitle')
        .addSelect('o.status', 'orderStatus')
        .addSelect('o.claim_deadline', 'claimDeadline')
        .addSelect('o.claims_closed_at', 'claimsClosedAt')
        .addSelect('o.currency', 'currency')
        .addSelect('l.chemical_id', 'chemicalId')
        .where('s.user_id = :userId', { userId })
        .andWhere('o.status IN (:...statuses)', { statuses: [...statuses] })
        .orderBy('o.id', 'DESC')
        .addOrderBy('s.id', 'ASC')
        .getRawMany<Record<string, unknown>>();
      return raw.map((row) => ({
        shareId: Number(row.shareId),
        amountMinor: row.amountMinor === null ? null : Number(row.amountMinor),
        paymentStatus: row.paymentStatus as SharePaymentStatus,
        containerId: row.containerId === null ? null : Number(row.containerId),
        orderId: Number(row.orderId),
        orderTitle: String(row.orderTitle),
        orderStatus: row.orderStatus as OrderStatus,
        claimDeadline: (row.claimDeadline as string | null) ?? null,
        claimsClosedAt: (row.claimsClosedAt as string | null) ?? null,
        currency: String(row.currency),
        chemicalId: Number(row.chemicalId),
      }));
    },
  };
}
export type TodayRepository = ReturnType<typeof todayRepository>;
