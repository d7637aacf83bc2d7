import { EntitySchema } from 'typeorm';

/**
 * A row of `ledger_change_notes`: "the ledger of this chemical changed", written in the same
 * transaction as the ledger entries. The alert rules run for it after the commit (the ledger
 * notes worker) and delete it in the transaction that queues their e-mails, so a change is
 * evaluated exactly once even across a crash; a failed evaluation leaves it for a later try.
 */
export interface LedgerChangeNoteRow {
  id: number;
  chemicalId: number;
  notedAt: string;
  attempts: number;
  /** When the worker may take it (again): at once when written, later after a failure. */
  nextAttemptAt: string;
  lastError: string | null;
}

export const LedgerChangeNoteEntity = new EntitySchema<LedgerChangeNoteRow>({
  name: 'LedgerChangeNote',
  tableName: 'ledger_change_notes',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    chemicalId: { name: 'chemical_id', type: 'integer' },
    notedAt: { name: 'noted_at', type: 'varchar', length: 24 },
    attempts: { type: 'integer', default: 0 },
    nextAttemptAt: { name: 'next_attempt_at', type: 'varchar', length: 24 },
    lastError: { name: 'last_error', type: 'text', nullable: true },
  },
  indices: [{ name: 'ledger_change_notes_due_idx', columns: ['nextAttemptAt', 'id'] }],
});
