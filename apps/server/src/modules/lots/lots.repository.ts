import { parseSort, type Lot, type LotListQuery } from '@lotwise/shared';
import { In, type EntityManager } from 'typeorm';
import { containsPattern } from '../../db/sql';
import { LotEntity, type LotRow } from './lot.entity';

export type LotValues = Omit<LotRow, 'id' | 'chemical'>;
type CertificateDetails = 'certificateSize' | 'certificateContentType' | 'certificateUploadedAt';
/** A new lot: the certificate's details come with its upload. */
export type NewLotValues = Omit<LotValues, CertificateDetails> &
  Partial<Pick<LotValues, CertificateDetails>>;

const sortColumns: Record<string, string> = {
  receivedOn: 'l.received_on',
  expiresOn: 'l.expires_on',
  chemical: 'LOWER(ch.name)',
  updatedAt: 'l.updated_at',
};

interface RawLot {
  id: number;
  chemicalId: number;
  chemicalName: string;
  defaultPurity: number;
  source: Lot['source'];
  supplierName: string | null;
  supplierLotNumber: string | null;
  grade: string | null;
  purityPercent: number | null;
  receivedOn: string;
  expiresOn: string | null;
  madeByRunId: number | null;
  certificateFileName: string | null;
  certificateSize: number | null;
  certificateContentType: string | null;
  certificateUploadedAt: string | null;
  notes: string;
  containerCount: number;
  createdAt: string;
  updatedAt: string;
}

function toLot({
  defaultPurity,
  certificateSize,
  certificateContentType,
  certificateUploadedAt,
  ...row
}: RawLot): Lot {
  return {
    ...row,
    certificate:
      row.certificateFileName && certificateUploadedAt
        ? {
            fileName: row.certificateFileName,
            size: Number(certificateSize ?? 0),
            contentType: certificateContentType ?? 'application/pdf',
            uploadedAt: certificateUploadedAt,
          }
        : null,
    id: Number(row.id),
    chemicalId: Number(row.chemicalId),
    madeByRunId: row.madeByRunId === null ? null : Number(row.madeByRunId),
    purityPercent: row.purityPercent ?? Number(defaultPurity),
    containerCount: Number(row.containerCount),
  };
}

/** Data access for `lots`; answers plain `Lot` objects. */
export function lotsRepository(manager: EntityManager) {
  const repo = manager.getRepository(LotEntity);

  const select = () =>
    manager
      .createQueryBuilder()
      .select('l.id', 'id')
      .addSelect('l.chemical_id', 'chemicalId')
      .addSelect('ch.name', 'chemicalName')
      .addSelect('ch.default_purity_percent', 'defaultPurity')
      .addSelect('l.source', 'source')
      .addSelect('l.supplier_name', 'supplierName')
      .addSelect('l.supplier_lot_number', 'supplierLotNumber')
      .addSelect('l.grade', 'grade')
      .addSelect('l.purity_percent', 'purityPercent')
      .addSelect('l.received_on', 'receivedOn')
      .addSelect('l.expires_on', 'expiresOn')
      .addSelect('l.made_by_run_id', 'madeByRunId')
      .addSelect('l.certificate_file_name', 'certificateFileName')
      .addSelect('l.certificate_size', 'certificateSize')
      .addSelect('l.certificate_content_type', 'certificateContentType')
      .addSelect('l.certificate_uploaded_at', 'certificateUploadedAt')
      .addSelect('l.notes', 'notes')
      .addSelect(
        "(SELECT COUNT(*) FROM containers c WHERE c.lot_id = l.id AND c.status <> 'disposed')",
        'containerCount',
      )
      .addSelect('l.created_at', 'createdAt')
      .addSelect('l.updated_at', 'updatedAt')
      .from('lots', 'l')
      .innerJoin('chemicals', 'ch', 'ch.id = l.chemical_id');

  return {
    async findRow(id: number): Promise<LotRow | null> {
      return repo.findOneBy({ id });
    },
    /** The lots of `ids` in one read, by id (missing ids are absent). */
    async rowsByIds(ids: number[]): Promise<Map<number, LotRow>> {
      const unique = [...new Set(ids)];
      if (unique.length === 0) return new Map();
      return new Map((await repo.findBy({ id: In(unique) })).map((row) => [row.id, row]));
    },
    async findById(id: number): Promise<Lot | null> {
      const row = await select().where('l.id = :id', { id }).getRawOne<RawLot>();
      return row ? toLot(row) : null;
    },
    async insert(values: NewLotValues): Promise<number> {
      const result = await repo.insert({
        certificateSize: null,
        certificateContentType: null,
        certificateUploadedAt: null,
        ...values,
      });
      return Number(result.identifiers[0]?.id);
    },
    async update(id: number, changes: Partial<LotValues>): Promise<void> {
      await repo.update({ id }, changes);
    },
    async delete(id: number): Promise<void> {
      await repo.delete({ id });
    },
    async countForChemical(chemicalId: number): Promise<number> {
      return repo.countBy({ chemicalId });
    },
    async list(query: LotListQuery): Promise<{ items: Lot[]; total: number }> {
      const qb = select();
      if (query.q) {
        qb.andWhere(
          "(ch.search_text LIKE :q ESCAPE '\\' OR LOWER(l.supplier_name) LIKE :q ESCAPE '\\' OR LOWER(l.supplier_lot_number) LIKE :q ESCAPE '\\')",
          { q: containsPattern(query.q.toLowerCase()) },
        );
      }
      if (query.chemicalId)
        qb.andWhere('l.chemical_id = :chemicalId', { chemicalId: query.chemicalId });
      if (query.source) qb.andWhere('l.source = :source', { source: query.source });
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
      const { field, direction } = parseSort(query.sort);
      const column = sortColumns[field] ?? sortColumns.receivedOn!;
      const rows = await qb
        // Lots without an expiry last in both directions (an index serves NULLS LAST).
        .addOrderBy(column, direction === 'desc' ? 'DESC' : 'ASC', 'NULLS LAST')
        .addOrderBy('l.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getRawMany<RawLot>();
      return { items: rows.map(toLot), total };
    },
  };
}
export type LotsRepository = ReturnType<typeof lotsRepository>;
