import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Runs: the crude yield carries its own flag (above 100 %: probably wet or impure), beside
 * the flag of the purified yield, so neither hides the other.
 */
export class RunCrudeYieldFlag1796620000000 implements MigrationInterface {
  name = 'RunCrudeYieldFlag1796620000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE "runs" ADD COLUMN "crude_yield_flag" text');
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE "runs" DROP COLUMN "crude_yield_flag"');
  }
}
