import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * A signed revision keeps its period pack's bytes (and their SHA-256), written with the
 * signature itself, so a signed period downloads the same file however the live records move.
 */
export class PeriodPacks1796252400000 implements MigrationInterface {
  name = 'PeriodPacks1796252400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE period_signature ADD COLUMN pack_pdf bytea, ADD COLUMN pack_sha256 char(64)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE period_signature DROP COLUMN pack_pdf, DROP COLUMN pack_sha256`);
  }
}
