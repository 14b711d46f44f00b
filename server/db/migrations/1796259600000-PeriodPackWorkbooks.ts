import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * A signed revision keeps its workbook too: the follow-ups and live records it lists move after
 * signing, and a signed period must download the same spreadsheet for good, as it does the PDF.
 */
export class PeriodPackWorkbooks1796259600000 implements MigrationInterface {
  name = 'PeriodPackWorkbooks1796259600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE period_signature ADD COLUMN pack_xlsx bytea, ADD COLUMN pack_xlsx_sha256 char(64)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE period_signature DROP COLUMN pack_xlsx, DROP COLUMN pack_xlsx_sha256`);
  }
}
