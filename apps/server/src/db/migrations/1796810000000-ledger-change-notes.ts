import { type MigrationInterface, type QueryRunner, Table, TableIndex } from 'typeorm';

/**
 * Ledger change notes: the chemicals whose ledger changed, written with the entries, so the
 * alert rules run after the commit instead of inside every draw. And an index of the ledger by
 * container and person, which the rules read to know who uses a chemical (instead of scanning
 * the ledger).
 */
export class LedgerChangeNotes1796810000000 implements MigrationInterface {
  name = 'LedgerChangeNotes1796810000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'ledger_change_notes',
        columns: [
          {
            name: 'id',
            type: 'integer',
            isPrimary: true,
            isGenerated: true,
            generationStrategy: 'increment',
          },
          { name: 'chemical_id', type: 'integer' },
          { name: 'noted_at', type: 'varchar', length: '24' },
          { name: 'attempts', type: 'integer', default: 0 },
          { name: 'next_attempt_at', type: 'varchar', length: '24' },
          { name: 'last_error', type: 'text', isNullable: true },
        ],
        indices: [{ name: 'ledger_change_notes_due_idx', columnNames: ['next_attempt_at', 'id'] }],
      }),
    );
    await queryRunner.createIndex(
      'ledger_entries',
      new TableIndex({
        name: 'ledger_entries_container_user_idx',
        columnNames: ['container_id', 'user_id'],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropIndex('ledger_entries', 'ledger_entries_container_user_idx');
    await queryRunner.dropTable('ledger_change_notes');
  }
}
