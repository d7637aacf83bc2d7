import { type MigrationInterface, type QueryRunner, TableColumn, TableIndex } from 'typeorm';

/**
 * Outbox leases: the sender that claims a message writes its claim id and until when the
 * claim holds, so a message whose sender stopped is picked up again once the lease runs out,
 * and never by two senders at once.
 */
export class OutboxLeases1796660000000 implements MigrationInterface {
  name = 'OutboxLeases1796660000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.addColumns('outbox', [
      new TableColumn({ name: 'claimed_by', type: 'varchar', length: '64', isNullable: true }),
      new TableColumn({ name: 'lease_until', type: 'varchar', length: '24', isNullable: true }),
    ]);
    await queryRunner.createIndex(
      'outbox',
      new TableIndex({ name: 'outbox_status_lease_idx', columnNames: ['status', 'lease_until'] }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropIndex('outbox', 'outbox_status_lease_idx');
    await queryRunner.dropColumns('outbox', ['claimed_by', 'lease_until']);
  }
}
