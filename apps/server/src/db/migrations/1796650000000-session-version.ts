import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * users.session_version: a counter every session token carries. Raising it (sign-out, a new
 * password, a role change, deactivation) ends every session of that user at once.
 */
export class SessionVersion1796650000000 implements MigrationInterface {
  name = 'SessionVersion1796650000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      'ALTER TABLE "users" ADD COLUMN "session_version" integer NOT NULL DEFAULT (0)',
    );
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE "users" DROP COLUMN "session_version"');
  }
}
