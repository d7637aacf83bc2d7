import type { MemberRequest, RequestListQuery, RequestStatus, StockUnit } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { lockForWrite } from '../../db/postgres';
import { fromMicro } from '../../db/quantities';
import { PurchaseRequestEntity, type PurchaseRequestRow } from './purchase-request.entity';

export type RequestValues = Omit<PurchaseRequestRow, 'id' | 'user' | 'chemical' | 'order'>;

const list = (value: unknown) => (typeof value === 'string' && value ? JSON.parse(value) : []);

function toView(raw: Record<string, unknown>): MemberRequest {
  const id = (value: unknown) => (value === null || value === undefined ? null : Number(value));
  return {
    id: Number(raw.id),
    chemical: {
      id: Number(raw.chemicalId),
      name: String(raw.chemicalName),
      casNumber: (raw.casNumber as string | null) ?? null,
      formula: (raw.formula as string | null) ?? null,
      physicalState: raw.physicalState as MemberRequest['chemical']['physicalState'],
      stockUnit: raw.stockUnit as StockUnit,
      ghsPictograms: list(raw.ghsPictograms),
      hazardStatements: list(raw.hazardStatements),
      storageGroup: raw.storageGroup as MemberRequest['chemical']['storageGroup'],
      restricted: Boolean(Number(raw.restricted)),
    },
    requester: { id: Number(raw.userId), displayName: String(raw.displayName) },
    quantity: fromMicro(raw.quantityMicro),
    unit: raw.unit as StockUnit,
    neededBy: (raw.neededBy as string | null) ?? null,
    note: String(raw.note ?? ''),
    status: raw.status as RequestStatus,
    orderId: id(raw.orderId),
    shareId: id(raw.shareId),
    createdAt: String(raw.createdAt),
    updatedAt: String(raw.updatedAt),
  };
}

/** Member requests with their chemical and requester; plain objects. */
export function requestsRepository(manager: EntityManager) {
  const requests = manager.getRepository(PurchaseRequestEntity);

  const view = () =>
    manager
      .createQueryBuilder()
      .select([
        'r.id AS id',
        'r.user_id AS "userId"',
        'r.chemical_id AS "chemicalId"',
        'r.quantity_micro AS "quantityMicro"',
        'r.unit AS unit',
        'r.needed_by AS "neededBy"',
        'r.note AS note',
        'r.status AS status',
        'r.order_id AS "orderId"',
        'r.share_id AS "shareId"',
        'r.created_at AS "createdAt"',
        'r.updated_at AS "updatedAt"',
        'u.display_name AS "displayName"',
        'ch.name AS "chemicalName"',
        'ch.cas_number AS "casNumber"',
        'ch.formula AS formula',
        'ch.physical_state AS "physicalState"',
        'ch.stock_unit AS "stockUnit"',
        'ch.ghs_pictograms AS "ghsPictograms"',
        'ch.hazard_statements AS "hazardStatements"',
        'ch.storage_group AS "storageGroup"',
        'ch.restricted AS restricted',
      ])
      .from('purchase_requests', 'r')
      .innerJoin('users', 'u', 'u.id = r.user_id')
      .innerJoin('chemicals', 'ch', 'ch.id = r.chemical_id');

  return {
    async insert(values: RequestValues): Promise<number> {
      const result = await requests.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async update(id: number, changes: Partial<RequestValues>): Promise<void> {
      await requests.update({ id }, changes);
    },
    /** In a transaction on PostgreSQL the request stays locked until it ends (folded once). */
    async findRow(id: number): Promise<PurchaseRequestRow | null> {
      return requests.findOne({ where: { id }, ...lockForWrite(manager) });
    },
    async findView(id: number): Promise<MemberRequest | null> {
      const raw = await view().where('r.id = :id', { id }).getRawOne<Record<string, unknown>>();
      return raw ? toView(raw) : null;
    },
    /**
     * Open requests first, by the date needed (none last), then the newest; `userId` keeps
     * one person's own.
     */
    async list(
      query: RequestListQuery,
      userId: number | null,
    ): Promise<{ items: MemberRequest[]; total: number }> {
      const qb = view().where('1 = 1');
      if (userId !== null) qb.andWhere('r.user_id = :userId', { userId });
      if (query.status) qb.andWhere('r.status = :status', { status: query.status });
      const total = Number(
        (
          await manager
            .createQueryBuilder()
            .select('COUNT(*)', 'n')
            .from(`(${qb.getQuery()})`, 'x')
            .setParameters(qb.getParameters())
            .getRawOne<{ n: number }>()
        )?.n ?? 0,
      );
      const rows = await qb
        .orderBy("CASE WHEN r.status = 'open' THEN 0 ELSE 1 END", 'ASC')
        .addOrderBy('CASE WHEN r.needed_by IS NULL THEN 1 ELSE 0 END', 'ASC')
        .addOrderBy('r.needed_by', 'ASC')
        .addOrderBy('r.id', 'DESC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getRawMany<Record<string, unknown>>();
      return { items: rows.map(toView), total };
    },
  };
}

export type RequestsRepository = ReturnType<typeof requestsRepository>;
