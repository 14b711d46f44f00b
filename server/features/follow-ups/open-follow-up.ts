import type { EntityManager } from 'typeorm';
import type { ViolationFacts } from '../../contracts/follow-ups.js';
import { mailFollowUpOpened } from '../notices/follow-up-mail.js';

export interface FollowUpToOpen {
  siteId: string;
  kind: string;
  sourceEntity: string;
  sourceId: string;
  title: string;
  dueAt: Date;
  /** For a violation's notices: when the site became aware, and from what. */
  awareAt?: Date;
  awareSource?: string;
  facts?: ViolationFacts;
}

/**
 * Opens a follow-up once: a second call for the same kind and source changes nothing. A new one
 * that is news at once (a violation's notice, a signed copy overdue) queues its mail in the same
 * transaction.
 */
export async function openFollowUp(manager: EntityManager, followUp: FollowUpToOpen): Promise<void> {
  const [opened]: Array<{ id: string }> = await manager.query(
    `INSERT INTO follow_up (site_id, kind, source_entity, source_id, title, due_at, aware_at, aware_source, facts)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)
     ON CONFLICT (kind, source_entity, source_id) DO NOTHING RETURNING id`,
    [
      followUp.siteId,
      followUp.kind,
      followUp.sourceEntity,
      followUp.sourceId,
      followUp.title,
      followUp.dueAt,
      followUp.awareAt ?? null,
      followUp.awareSource?.slice(0, 300) ?? null,
      followUp.facts ? JSON.stringify(followUp.facts) : null,
    ],
  );
  if (opened) await mailFollowUpOpened(manager, { ...followUp, id: opened.id });
}
