import type { DataSource } from 'typeorm';

/**
 * The privileges of the role the app runs as: it owns nothing and is no superuser, so it cannot
 * switch the trail's triggers off, change `session_replication_role`, or alter a table. It may
 * read and write records, but only read and append to the trail, and only read its chain head.
 * Run after every migration, so new tables are covered; GRANT and REVOKE are idempotent.
 */
export async function grantAppRole(dataSource: DataSource, role: string): Promise<void> {
  const [exists] = await dataSource.query('SELECT rolsuper FROM pg_roles WHERE rolname = $1', [role]);
  if (!exists) throw new Error(`The app's database role "${role}" does not exist; see the README on an existing PostgreSQL`);
  if (exists.rolsuper) throw new Error(`The app's database role "${role}" is a superuser: it must not be`);
  const name = `"${role.replace(/"/g, '""')}"`;
  // Raw SQL: privileges are DDL, which TypeORM does not model.
  for (const statement of [
    `GRANT USAGE ON SCHEMA public TO ${name}`,
    `GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO ${name}`,
    `GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO ${name}`,
    `REVOKE UPDATE, DELETE, TRUNCATE, REFERENCES, TRIGGER ON trail_entry FROM ${name}`,
    `REVOKE INSERT, UPDATE, DELETE, TRUNCATE ON trail_chain_head FROM ${name}`,
    // Signed revisions and amendments are appended, never changed (their triggers refuse it too).
    `REVOKE UPDATE, DELETE, TRUNCATE ON period_signature, period_amendment FROM ${name}`,
    // Application sheets are appended versions; tank checks are kept as run (their triggers refuse changes too).
    `REVOKE UPDATE, DELETE, TRUNCATE ON application_sheet FROM ${name}`,
    `REVOKE DELETE, TRUNCATE ON tank_check FROM ${name}`,
    `REVOKE ALL ON migrations FROM ${name}`,
    // The job queue's schema: the app queues and works jobs; the owner created and migrates it.
    `GRANT USAGE ON SCHEMA pgboss TO ${name}`,
    `GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA pgboss TO ${name}`,
    `GRANT EXECUTE ON ALL FUNCTIONS IN SCHEMA pgboss TO ${name}`,
  ]) {
    await dataSource.query(statement);
  }
}
