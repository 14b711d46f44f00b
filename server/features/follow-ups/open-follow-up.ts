import type { EntityManager } from 'typeorm';

export interface FollowUpToOpen {
  siteId: string;
  kind: string;
  sourceEntity: string;
  sourceId: string;
  title: string;
  dueAt: Date;
}

/** Opens a follow-up once: a second call for the same kind and source changes nothing. */
export async function openFollowUp(manager: EntityManager, followUp: FollowUpToOpen): Promise<void> {
  await manager.query(
    `INSERT INTO follow_up (site_id, kind, source_entity, source_id, title, due_at) VALUES ($1, $2, $3, $4, $5, $6)
     ON CONFLICT (kind, source_entity, source_id) DO NOTHING`,
    [followUp.siteId, followUp.kind, followUp.sourceEntity, followUp.sourceId, followUp.title, followUp.dueAt],
  );
}
