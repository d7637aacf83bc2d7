import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Procedures gain their steps (text, duration, temperature window, addition, caution, hold
 * point), kept in order as one JSON list: a step is always read and replaced with its
 * procedure, never on its own.
 */
export class ProcedureSteps1796950000000 implements MigrationInterface {
  name = 'ProcedureSteps1796950000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE "procedures" ADD COLUMN "steps" text NOT NULL DEFAULT '[]'`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE "procedures" DROP COLUMN "steps"');
  }
}
