import {
  type MigrationInterface,
  type QueryRunner,
  Table,
  TableColumn,
  TableForeignKey,
} from 'typeorm';

const fileColumns = (prefix: string, withNames: boolean) => [
  ...(withNames
    ? [
        new TableColumn({
          name: `${prefix}_file_name`,
          type: 'varchar',
          length: '255',
          isNullable: true,
        }),
        new TableColumn({
          name: `${prefix}_stored_name`,
          type: 'varchar',
          length: '100',
          isNullable: true,
        }),
      ]
    : []),
  new TableColumn({ name: `${prefix}_size`, type: 'integer', isNullable: true }),
  new TableColumn({
    name: `${prefix}_content_type`,
    type: 'varchar',
    length: '40',
    isNullable: true,
  }),
  new TableColumn({
    name: `${prefix}_uploaded_at`,
    type: 'varchar',
    length: '24',
    isNullable: true,
  }),
];

/**
 * CSV imports of stock (`imports`), the safety data sheet of a chemical, and size, type and
 * time of a lot's certificate (its name columns came with the stock migration).
 */
export class ImportsAndFiles1796340000000 implements MigrationInterface {
  name = 'ImportsAndFiles1796340000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.addColumns('chemicals', fileColumns('sds', true));
    await queryRunner.addColumns('lots', fileColumns('certificate', false));

    await queryRunner.createTable(
      new Table({
        name: 'imports',
        columns: [
          {
            name: 'id',
            type: 'integer',
            isPrimary: true,
            isGenerated: true,
            generationStrategy: 'increment',
          },
          { name: 'status', type: 'varchar', length: '12' },
          { name: 'file_name', type: 'varchar', length: '255' },
          { name: 'user_id', type: 'integer', isNullable: true },
          { name: 'total_rows', type: 'integer' },
          { name: 'processed_rows', type: 'integer' },
          { name: 'error_count', type: 'integer' },
          { name: 'errors', type: 'text' },
          { name: 'warnings', type: 'text' },
          { name: 'summary', type: 'text', isNullable: true },
          { name: 'rows', type: 'text', isNullable: true },
          { name: 'failure', type: 'text', isNullable: true },
          { name: 'created_at', type: 'varchar', length: '24' },
          { name: 'updated_at', type: 'varchar', length: '24' },
          { name: 'committed_at', type: 'varchar', length: '24', isNullable: true },
        ],
        indices: [{ name: 'imports_created_at_idx', columnNames: ['created_at'] }],
        foreignKeys: [
          new TableForeignKey({
            name: 'imports_user_fk',
            columnNames: ['user_id'],
            referencedTableName: 'users',
            referencedColumnNames: ['id'],
            onDelete: 'SET NULL',
          }),
        ],
      }),
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.dropTable('imports');
    for (const column of fileColumns('certificate', false).reverse())
      await queryRunner.dropColumn('lots', column.name);
    for (const column of fileColumns('sds', true).reverse())
      await queryRunner.dropColumn('chemicals', column.name);
  }
}
