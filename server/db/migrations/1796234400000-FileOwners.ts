import type { QueryRunner, MigrationInterface } from 'typeorm';

/**
 * Every stored file belongs to a site and to one record (its owner) from the moment it is
 * uploaded: downloads are authorised through that record, and a file can be attached only to
 * a record of its own site, once. Existing files get their owner from what refers to them, or
 * from the trail entry that first named them; an upload nothing ever named is dropped (no
 * route could reach it).
 */
export class FileOwners1796234400000 implements MigrationInterface {
  name = 'FileOwners1796234400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`SET LOCAL decant.via_app = 'on'`);
    await q.query(`ALTER TABLE stored_file
      ADD COLUMN site_id uuid REFERENCES site(id) ON DELETE RESTRICT,
      ADD COLUMN purpose varchar(30),
      ADD COLUMN owner_entity varchar(40),
      ADD COLUMN owner_id uuid`);
    await q.query(`UPDATE stored_file f SET site_id = c.site_id, purpose = 'certificate', owner_entity = 'lab-certificate', owner_id = c.id
      FROM lab_certificate c WHERE c.file_id = f.id`);
    await q.query(`UPDATE stored_file f SET site_id = s.site_id, purpose = 'signed-copy', owner_entity = 'shipment', owner_id = s.id
      FROM shipment_file sf JOIN shipment s ON s.id = sf.shipment_id WHERE sf.file_id = f.id AND f.owner_id IS NULL`);
    await q.query(`UPDATE stored_file f SET site_id = u.site_id, purpose = 'follow-up-evidence', owner_entity = 'follow-up', owner_id = u.id
      FROM follow_up u WHERE u.closing_file_id = f.id AND f.owner_id IS NULL`);
    await q.query(`UPDATE stored_file f SET site_id = k.site_id, purpose = 'upkeep-photo', owner_entity = 'upkeep-check', owner_id = k.id
      FROM upkeep_check k, jsonb_array_elements(k.items) item WHERE item->>'photoFileId' = f.id::text AND f.owner_id IS NULL`);
    // A certificate's earlier PDF, replaced since: the trail entry that named it says whose it was.
    await q.query(`UPDATE stored_file f SET site_id = t.site_id, purpose = 'certificate', owner_entity = t.entity, owner_id = t.entity_id::uuid
      FROM trail_entry t WHERE f.owner_id IS NULL AND t.entity = 'lab-certificate' AND t.site_id IS NOT NULL
        AND (t.before::text LIKE '%' || f.id::text || '%' OR t.after::text LIKE '%' || f.id::text || '%')`);
    await q.query(`DELETE FROM stored_file WHERE site_id IS NULL`);
    await q.query(`ALTER TABLE stored_file ALTER COLUMN site_id SET NOT NULL, ALTER COLUMN purpose SET NOT NULL,
      ADD CONSTRAINT stored_file_purpose_check CHECK (purpose IN ('certificate', 'signed-copy', 'follow-up-evidence', 'upkeep-photo')),
      ADD CONSTRAINT stored_file_owner_check CHECK ((owner_entity IS NULL) = (owner_id IS NULL))`);
    await q.query(`CREATE INDEX "IDX_stored_file_owner" ON stored_file (owner_entity, owner_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP INDEX "IDX_stored_file_owner"');
    await q.query('ALTER TABLE stored_file DROP COLUMN site_id, DROP COLUMN purpose, DROP COLUMN owner_entity, DROP COLUMN owner_id');
  }
}
