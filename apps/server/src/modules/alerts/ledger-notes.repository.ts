import { In, type EntityManager } from 'typeorm';
import { LedgerChangeNoteEntity } from './ledger-change-note.entity';

/** A note the worker takes: which chemical, and how often its evaluation failed so far. */
export interface DueNote {
  id: number;
  chemicalId: number;
  attempts: number;
}

/** Data access for `ledger_change_notes` (see the entity). */
export function ledgerNotesRepository(manager: EntityManager) {
  const notes = manager.getRepository(LedgerChangeNoteEntity);
  return {
    /** One note per chemical, due at once. */
    async noteChanges(chemicalIds: number[], at: string): Promise<void> {
      if (chemicalIds.length === 0) return;
      // `updateEntity(false)`: nothing to read back, one statement per transaction
      await notes
        .createQueryBuilder()
        .insert()
        .values(
          chemicalIds.map((chemicalId) => ({
            chemicalId,
            notedAt: at,
            attempts: 0,
            nextAttemptAt: at,
            lastError: null,
          })),
        )
        .updateEntity(false)
        .execute();
    },
    /** Up to `limit` notes due at `now`, oldest first. */
    async dueNotes(now: string, limit: number): Promise<DueNote[]> {
      const rows = await notes
        .createQueryBuilder('n')
        .select(['n.id', 'n.chemicalId', 'n.attempts'])
        .where('n.nextAttemptAt <= :now', { now })
        .orderBy('n.nextAttemptAt', 'ASC')
        .addOrderBy('n.id', 'ASC')
        .limit(limit)
        .getMany();
      return rows.map((row) => ({
        id: row.id,
        chemicalId: row.chemicalId,
        attempts: row.attempts,
      }));
    },
    /** When the next note falls due; null when there is none. */
    async nextNoteAt(): Promise<string | null> {
      const row = await notes
        .createQueryBuilder('n')
        .select('MIN(n.nextAttemptAt)', 'at')
        .getRawOne<{ at: string | null }>();
      return row?.at ?? null;
    },
    async deleteNotes(ids: number[]): Promise<void> {
      if (ids.length > 0) await notes.delete({ id: In(ids) });
    },
    /** A failed evaluation: the notes wait until `nextAttemptAt`, with the error kept. */
    async deferNotes(ids: number[], nextAttemptAt: string, error: string): Promise<void> {
      if (ids.length === 0) return;
      await notes
        .createQueryBuilder()
        .update()
        .set({ nextAttemptAt, lastError: error.slice(0, 2000), attempts: () => 'attempts + 1' })
        .where({ id: In(ids) })
        .execute();
    },
  };
}
export type LedgerNotesRepository = ReturnType<typeof ledgerNotesRepository>;
