import { type MigrationInterface, type QueryRunner, Table, TableForeignKey } from 'typeorm';

const timestamps = [
  { name: 'created_at', type: 'varchar', length: '24' },
  { name: 'updated_at', type: 'varchar', length: '24' },
];

/**
 * Users, audit events and chemicals. Written with TypeORM's schema API rather than raw SQL
 * so the same migration creates the tables on SQLite and on PostgreSQL.
 */
export class Initial1796160000000 implements MigrationInterface {
  name = 'Initial1796160000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.createTable(
      new Table({
        name: 'users',
        columns: [
          {
            name: 'id',
            type: 'integer',
            isPrimary: true,
            isGenerated: true,
            generationStrategy: 'increment',
          },
          { name: 'email', type: 'varchar', length: '254' },
          { name: 'display_name', type: 'varchar', length: '120' },
          { name: 'password_hash', type: 'varchar', length: '100', isNullable: true },
          { name: 'role', type: 'varchar', length: '20' },
          { name: 'active', type: 'boolean' },
          { name: 'invite_token_hash', type: 'varchar', length: '64', isNullable: true },
          { name: 'invite_expires_at', type: 'varchar', length: '24', isNullable: true },
          { name: 'last_login_at', type: 'varchar', length: '24', isNullable: true },
          ...timestamps,
        ],
        indices: [
          { name: 'users_email_unique', columnNames: ['email'], isUnique: true },
          { name: 'users_invite_token_hash_idx', columnNames: ['invite_token_hash'] },
        ],
        checks: [
          {
            name: 'users_role_check',
            expression: `role IN ('admin', 'manager', 'member', 'viewer')`,
          },
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'audit_events',
        columns: [
          {
            name: 'id',
            type: 'integer',
            isPrimary: true,
            isGenerated: true,
            generationStrategy: 'increment',
          },
          { name: 'actor_id', type: 'integer', isNullable: true },
          { name: 'action', type: 'varchar', length: '60' },
          { name: 'target_type', type: 'varchar', length: '40' },
          { name: 'target_id', type: 'integer', isNullable: true },
          { name: 'detail', type: 'text' },
          { name: 'created_at', type: 'varchar', length: '24' },
        ],
        indices: [{ name: 'audit_events_created_at_idx', columnNames: ['created_at'] }],
        foreignKeys: [
          new TableForeignKey({
            name: 'audit_events_actor_fk',
            columnNames: ['actor_id'],
            referencedTableName: 'users',
            referencedColumnNames: ['id'],
            onDelete: 'SET NULL',
          }),
        ],
      }),
    );

    await queryRunner.createTable(
      new Table({
        name: 'chemicals',
        columns: [
          {
            name: 'id',
            type: 'integer',
            isPrimary: true,
            isGenerated: true,
            generationStrategy: 'increment',
          },
          { name: 'name', type: 'varchar', length: '200' },
          { name: 'synonyms', type: 'text' },
          { name: 'cas_number', type: 'varchar', length: '12', isNullable: true },
          { name: 'formula', type: 'varchar', length: '120', isNullable: true },
          { name: 'molar_mass', type: 'double precision', isNullable: true },
          { name: 'physical_state', type: 'varchar', length: '10' },
          { name: 'density', type: 'double precision', isNullable: true },
          { name: 'default_purity_percent', type: 'double precision' },
          { name: 'ghs_pictograms', type: 'text' },
          { name: 'hazard_statements', type: 'text' },
          { name: 'storage_group', type: 'varchar', length: '20' },
          { name: 'peroxide_class', type: 'varchar', length: '1', isNullable: true },
          { name: 'stock_unit', type: 'varchar', length: '4' },
          { name: 'reorder_point', type: 'double precision', isNullable: true },
          { name: 'reorder_quantity', type: 'double precision', isNullable: true },
          { name: 'restricted', type: 'boolean' },
          { name: 'notes', type: 'text' },
          { name: 'search_text', type: 'text' },
          ...timestamps,
        ],
        indices: [
          { name: 'chemicals_name_idx', columnNames: ['name'] },
          { name: 'chemicals_cas_number_unique', columnNames: ['cas_number'], isUnique: true },
          { name: 'chemicals_storage_group_idx', columnNames: ['storage_group'] },
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('chemicals');
    await queryRunner.dropTable('audit_events');
    await queryRunner.dropTable('users');
  }
}
