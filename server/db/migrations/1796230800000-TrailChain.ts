import type { QueryRunner, MigrationInterface } from 'typeorm';

/** The regulated tables: a change made to them outside Decant is caught and written to the trail. */
export const watchedTables = [
  'lab_certificate',
  'lab_sample',
  'lab_result',
  'flow_reading',
  'permit',
  'permit_limit',
  'shipment',
  'oil_log_entry',
] as const;

/**
 * A trail that proves itself. Each entry carries the hash of the one before and its own
 * (SHA-256 over the previous hash and its content), numbered without gaps by `chain_seq`; the
 * head of the chain lives in a one-row table only the trigger writes. `trail_chain_break()`
 * recomputes the chain and answers the first entry that does not hold. Changes to regulated
 * tables made by anyone but the app (whose role sets `decant.via_app`) are written to the trail
 * as made outside Decant.
 */
export class TrailChain1796230800000 implements MigrationInterface {
  name = 'TrailChain1796230800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE trail_entry ADD COLUMN chain_seq bigint, ADD COLUMN prev_hash char(64), ADD COLUMN hash char(64)`);
    await q.query(`CREATE TABLE trail_chain_head (
      only_row boolean PRIMARY KEY DEFAULT true CONSTRAINT trail_chain_head_only_row_check CHECK (only_row),
      seq bigint NOT NULL,
      hash char(64) NOT NULL
    )`);
    await q.query(`INSERT INTO trail_chain_head (seq, hash) VALUES (0, repeat('0', 64))`);
    // What an entry's hash covers; the verification recomputes it the same way.
    await q.query(`CREATE FUNCTION trail_entry_digest(prev char(64), e trail_entry) RETURNS char(64)
      LANGUAGE sql IMMUTABLE AS $$
        SELECT encode(sha256(convert_to(concat_ws('|', prev, e.chain_seq, to_char(e.occurred_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US'),
          e.actor_id, e.actor_email, e.action, e.entity, e.entity_id, e.site_id, e.before::text, e.after::text), 'UTF8')), 'hex')
      $$`);
    await q.query(`CREATE FUNCTION trail_entry_chain() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      DECLARE head trail_chain_head;
      BEGIN
        -- The head's row lock serialises writers; FOR UPDATE reads its latest committed version.
        SELECT * INTO head FROM trail_chain_head FOR UPDATE;
        NEW.chain_seq := head.seq + 1;
        NEW.prev_hash := head.hash;
        NEW.hash := trail_entry_digest(head.hash, NEW);
        UPDATE trail_chain_head SET seq = NEW.chain_seq, hash = NEW.hash;
        RETURN NEW;
      END $$`);
    // Existing entries join the chain in the order they were written.
    await q.query(`ALTER TABLE trail_entry DISABLE TRIGGER trail_entry_no_update_or_delete`);
    await q.query(`DO $$ DECLARE e trail_entry; prev char(64) := repeat('0', 64); n bigint := 0;
      BEGIN
        FOR e IN SELECT * FROM trail_entry ORDER BY id LOOP
          n := n + 1;
          e.chain_seq := n;
          UPDATE trail_entry SET chain_seq = n, prev_hash = prev, hash = trail_entry_digest(prev, e) WHERE id = e.id
            RETURNING hash INTO prev;
        END LOOP;
        UPDATE trail_chain_head SET seq = n, hash = prev;
      END $$`);
    await q.query(`ALTER TABLE trail_entry ENABLE TRIGGER trail_entry_no_update_or_delete`);
    await q.query(
      `ALTER TABLE trail_entry ALTER COLUMN chain_seq SET NOT NULL, ALTER COLUMN prev_hash SET NOT NULL, ALTER COLUMN hash SET NOT NULL`,
    );
    await q.query(`CREATE UNIQUE INDEX "UQ_trail_entry_chain_seq" ON trail_entry (chain_seq)`);
    await q.query(`CREATE TRIGGER trail_entry_chain BEFORE INSERT ON trail_entry FOR EACH ROW EXECUTE FUNCTION trail_entry_chain()`);

    await q.query(`CREATE FUNCTION trail_chain_break() RETURNS TABLE (chain_seq bigint, id bigint, reason text)
      LANGUAGE sql STABLE AS $$
        SELECT c.chain_seq, c.id,
               CASE WHEN c.chain_seq <> c.position THEN 'an entry is missing before this one'
                    WHEN c.prev_hash <> coalesce(c.hash_before, repeat('0', 64)) THEN 'it does not follow the entry before it'
                    ELSE 'its content no longer matches its hash' END
          FROM (SELECT e.chain_seq, e.id, e.prev_hash, e.hash, trail_entry_digest(e.prev_hash, e) AS recomputed,
                       row_number() OVER w AS position, lag(e.hash) OVER w AS hash_before
                  FROM trail_entry e WINDOW w AS (ORDER BY e.chain_seq)) c
         WHERE c.chain_seq <> c.position OR c.prev_hash <> coalesce(c.hash_before, repeat('0', 64)) OR c.hash <> c.recomputed
         ORDER BY c.chain_seq
         LIMIT 1
      $$`);

    await q.query(`CREATE FUNCTION record_change_outside_decant() RETURNS trigger LANGUAGE plpgsql SECURITY DEFINER SET search_path = public AS $$
      BEGIN
        IF coalesce(current_setting('decant.via_app', true), '') = 'on' THEN
          RETURN NULL;
        END IF;
        INSERT INTO trail_entry (actor_id, actor_email, action, entity, entity_id, site_id, before, after)
        VALUES (NULL, 'outside Decant: ' || session_user, lower(TG_OP) || '-outside-decant', TG_TABLE_NAME,
                coalesce(CASE WHEN TG_OP = 'DELETE' THEN to_jsonb(OLD) ELSE to_jsonb(NEW) END ->> 'id', '?'),
                (CASE WHEN TG_OP = 'DELETE' THEN to_jsonb(OLD) ELSE to_jsonb(NEW) END ->> 'site_id')::uuid,
                CASE WHEN TG_OP = 'INSERT' THEN NULL ELSE to_jsonb(OLD) END,
                CASE WHEN TG_OP = 'DELETE' THEN NULL ELSE to_jsonb(NEW) END);
        RETURN NULL;
      END $$`);
    for (const table of watchedTables) {
      await q.query(`CREATE TRIGGER ${table}_outside_decant AFTER INSERT OR UPDATE OR DELETE ON ${table}
        FOR EACH ROW EXECUTE FUNCTION record_change_outside_decant()`);
    }
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of watchedTables) await q.query(`DROP TRIGGER ${table}_outside_decant ON ${table}`);
    await q.query('DROP FUNCTION record_change_outside_decant()');
    await q.query('DROP FUNCTION trail_chain_break()');
    await q.query('DROP TRIGGER trail_entry_chain ON trail_entry');
    await q.query('DROP FUNCTION trail_entry_chain()');
    await q.query('DROP FUNCTION trail_entry_digest(char, trail_entry)');
    await q.query('DROP TABLE trail_chain_head');
    await q.query('DROP INDEX "UQ_trail_entry_chain_seq"');
    await q.query('ALTER TABLE trail_entry DROP COLUMN chain_seq, DROP COLUMN prev_hash, DROP COLUMN hash');
  }
}
