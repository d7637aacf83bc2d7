import type { ImportListQuery, ImportStatus } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { lockForWrite, undoneOnError } from '../../db/postgres';
import { ChemicalEntity } from '../chemicals/chemical.entity';
import { ContainerEntity } from '../containers/container.entity';
import type { ContainerValues, LedgerEntryValues } from '../containers/containers.repository';
import { LedgerEntryEntity } from '../containers/ledger-entry.entity';
import { LocationEntity } from '../locations/location.entity';
import { ImportEntity, type ImportRow } from './import.entity';
import type { KnownChemical, KnownLocation, KnownLot } from './import-plan';

export type ImportValues = Omit<ImportRow, 'id' | 'user' | 'supplier'>;
/** An import without its stored rows (they are large and only the commit reads them). */
export type ImportHead = Omit<ImportRow, 'rows' | 'user' | 'supplier'> & {
  createdByName: string | null;
  supplierName: string | null;
};

/** Rows per multi-row INSERT: well below SQLite's limit of bound values per statement. */
const insertChunk = 400;
const lookupChunk = 500;

function chunks<T>(list: T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < list.length; i += size) out.push(list.slice(i, i + size));
  return out;
}

const headColumnList: (keyof ImportRow)[] = [
  'id',
  'kind',
  'supplierId',
  'status',
  'fileName',
  'userId',
  'totalRows',
  'processedRows',
  'errorCount',
  'errors',
  'warnings',
  'summary',
  'failure',
  'createdAt',
  'updatedAt',
  'committedAt',
];

const select = <K extends string>(keys: readonly K[]) =>
  Object.fromEntries(keys.map((key) => [key, true])) as Record<K, true>;
const headColumns = select(headColumnList);

/** Data access for `imports`, and the bulk reads and writes an import needs. */
export function importsRepository(manager: EntityManager) {
  const repo = manager.getRepository(ImportEntity);

  async function withNames(
    rows: Omit<ImportRow, 'rows' | 'user' | 'supplier'>[],
  ): Promise<ImportHead[]> {
    const ids = [...new Set(rows.flatMap((row) => (row.userId ? [row.userId] : [])))];
    const names = new Map<number, string>();
    if (ids.length) {
      const users: { id: number; name: string }[] = await manager
        .createQueryBuilder()
        .select('u.id', 'id')
        .addSelect('u.display_name', 'name')
        .from('users', 'u')
        .where('u.id IN (:...ids)', { ids })
        .getRawMany();
      for (const user of users) names.set(Number(user.id), user.name);
    }
    const supplierIds = [
      ...new Set(rows.flatMap((row) => (row.supplierId ? [row.supplierId] : []))),
    ];
    const supplierNames = new Map<number, string>();
    if (supplierIds.length) {
      const suppliers: { id: number; name: string }[] = await manager
        .createQueryBuilder()
        .select('s.id', 'id')
        .addSelect('s.name', 'name')
        .from('suppliers', 's')
        .where('s.id IN (:...supplierIds)', { supplierIds })
        .getRawMany();
      for (const supplier of suppliers) supplierNames.set(Number(supplier.id), supplier.name);
    }
    return rows.map((row) => ({
      ...row,
      createdByName: row.userId ? (names.get(row.userId) ?? null) : null,
      supplierName: row.supplierId ? (supplierNames.get(row.supplierId) ?? null) : null,
    }));
  }

  return {
    async insert(values: ImportValues): Promise<number> {
      const result = await repo.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async update(id: number, changes: Partial<ImportValues>): Promise<void> {
      await repo.update({ id }, changes);
    },
    /**
     * Marks an import failed only if it is still as it was read (`status`, `updatedAt`);
     * answers false when it moved on meanwhile (its check or commit finished).
     */
    async markInterrupted(
      head: Pick<ImportHead, 'id' | 'status' | 'updatedAt'>,
      failure: string,
      now: string,
    ): Promise<boolean> {
      const result = await repo.update(
        { id: head.id, status: head.status, updatedAt: head.updatedAt },
        { status: 'failed', failure, updatedAt: now },
      );
      return (result.affected ?? 0) > 0;
    },
    /** In a transaction on PostgreSQL the import stays locked until it ends (one commit at a time). */
    async findHead(id: number): Promise<ImportHead | null> {
      const row = await repo.findOne({
        where: { id },
        select: headColumns,
        ...lockForWrite(manager),
      });
      return row ? ((await withNames([row]))[0] ?? null) : null;
    },
    async findRows(id: number): Promise<string | null> {
      const row = await repo.findOne({ where: { id }, select: { id: true, rows: true } });
      return row?.rows ?? null;
    },
    async list(query: ImportListQuery): Promise<{ items: ImportHead[]; total: number }> {
      const where = query.status ? { status: query.status as ImportStatus } : {};
      const [rows, total] = await repo.findAndCount({
        where,
        select: select(headColumnList.filter((c) => c !== 'errors')),
        order: { createdAt: query.sort.endsWith('.asc') ? 'ASC' : 'DESC', id: 'DESC' },
        skip: (query.page - 1) * query.pageSize,
        take: query.pageSize,
      });
      return { items: await withNames(rows.map((row) => ({ ...row, errors: [] }))), total };
    },

    /** Every chemical, with what the import needs to match and convert. */
    async knownChemicals(): Promise<KnownChemical[]> {
      const rows = await manager.getRepository(ChemicalEntity).find({
        select: select([
          'id',
          'name',
          'casNumber',
          'stockUnit',
          'density',
          'physicalState',
          'bulkDensity',
          'peroxideClass',
        ] as const),
      });
      return rows.map((row) => ({
        id: row.id,
        name: row.name,
        casNumber: row.casNumber,
        stockUnit: row.stockUnit,
        density: row.density,
        physicalState: row.physicalState,
        bulkDensity: row.bulkDensity,
        peroxideClass: row.peroxideClass,
      }));
    },
    async knownLocations(): Promise<KnownLocation[]> {
      const rows = await manager.getRepository(LocationEntity).find({
        select: { id: true, path: true },
      });
      return rows.map((row) => ({ id: row.id, path: row.path }));
    },
    /** Lots with a supplier lot number of these chemicals. */
    async lotsWithNumbers(chemicalIds: number[]): Promise<KnownLot[]> {
      const out: KnownLot[] = [];
      for (const ids of chunks(chemicalIds, lookupChunk)) {
        const rows: Record<string, unknown>[] = await manager
          .createQueryBuilder()
          .select('l.id', 'id')
          .addSelect('l.chemical_id', 'chemicalId')
          .addSelect('l.supplier_name', 'supplierName')
          .addSelect('l.supplier_lot_number', 'supplierLotNumber')
          .addSelect('l.received_on', 'receivedOn')
          .addSelect('l.expires_on', 'expiresOn')
          .from('lots', 'l')
          .where('l.chemical_id IN (:...ids)', { ids })
          .andWhere('l.supplier_lot_number IS NOT NULL')
          .orderBy('l.id', 'ASC')
          .getRawMany();
        for (const row of rows) {
          out.push({
            id: Number(row.id),
            chemicalId: Number(row.chemicalId),
            supplierName: (row.supplierName as string | null) ?? null,
            supplierLotNumber: String(row.supplierLotNumber),
            receivedOn: String(row.receivedOn),
            expiresOn: (row.expiresOn as string | null) ?? null,
          });
        }
      }
      return out;
    },
    /** Which of `codes` are already on a container. */
    async takenLabelCodes(codes: string[]): Promise<Set<string>> {
      const taken = new Set<string>();
      for (const part of chunks([...new Set(codes)], lookupChunk)) {
        const rows: { code: string }[] = await manager
          .createQueryBuilder()
          .select('c.label_code', 'code')
          .from('containers', 'c')
          .where('c.label_code IN (:...part)', { part })
          .getRawMany();
        for (const row of rows) taken.add(row.code);
      }
      return taken;
    },

    /** Inserts containers in multi-row statements; answers label code -> id. */
    async insertContainers(values: ContainerValues[]): Promise<Map<string, number>> {
      const ids = new Map<string, number>();
      for (const part of chunks(values, insertChunk)) {
        // A taken label code fails the insert; the caller then reads which one it was.
        await undoneOnError(manager, () =>
          manager
            .createQueryBuilder()
            .insert()
            .into(ContainerEntity)
            .values(part)
            .updateEntity(false)
            .execute(),
        );
        const codes = part.map((c) => c.labelCode);
        const rows: { id: number; code: string }[] = await manager
          .createQueryBuilder()
          .select('c.id', 'id')
          .addSelect('c.label_code', 'code')
          .from('containers', 'c')
          .where('c.label_code IN (:...codes)', { codes })
          .getRawMany();
        for (const row of rows) ids.set(row.code, Number(row.id));
      }
      return ids;
    },
    /** Appends ledger entries in multi-row statements. */
    async insertEntries(values: LedgerEntryValues[]): Promise<void> {
      for (const part of chunks(values, insertChunk)) {
        await manager
          .createQueryBuilder()
          .insert()
          .into(LedgerEntryEntity)
          .values(part)
          .updateEntity(false)
          .execute();
      }
    },
  };
}
export type ImportsRepository = ReturnType<typeof importsRepository>;
