import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * Report and document numbers are unique by their compared form (server/domain/document-key.ts),
 * within a site: "BAS-123", "bas-123 " and "BAS\u200B-123" are one number, and whether another
 * site has a number is none of this site's business.
 */
export class DocumentKeys1796238000000 implements MigrationInterface {
  name = 'DocumentKeys1796238000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE FUNCTION document_key(text) RETURNS text LANGUAGE sql IMMUTABLE STRICT PARALLEL SAFE AS $$
      SELECT lower(btrim(regexp_replace(regexp_replace(normalize(btrim($1), NFKC),
        '[\\u00AD\\u200B-\\u200F\\u202A-\\u202E\\u2060-\\u2064\\u2066-\\u2069\\uFEFF]', '', 'g'), '\\s+', ' ', 'g')))
    $$`);
    await q.query('ALTER TABLE lab_certificate DROP CONSTRAINT lab_certificate_lab_name_report_number_key');
    await q.query(
      `CREATE UNIQUE INDEX "UQ_lab_certificate_report" ON lab_certificate (site_id, document_key(lab_name), document_key(report_number))`,
    );
    await q.query('ALTER TABLE shipment DROP CONSTRAINT shipment_site_id_document_kind_document_number_key');
    await q.query(`CREATE UNIQUE INDEX "UQ_shipment_document" ON shipment (site_id, document_kind, document_key(document_number))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP INDEX "UQ_shipment_document"');
    await q.query(
      'ALTER TABLE shipment ADD CONSTRAINT shipment_site_id_document_kind_document_number_key UNIQUE (site_id, document_kind, document_number)',
    );
    await q.query('DROP INDEX "UQ_lab_certificate_report"');
    await q.query('ALTER TABLE lab_certificate ADD CONSTRAINT lab_certificate_lab_name_report_number_key UNIQUE (lab_name, report_number)');
    await q.query('DROP FUNCTION document_key(text)');
  }
}
