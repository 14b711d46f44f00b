import type { EntityManager } from 'typeorm';
import type { Actor } from '../../kernel/trail/trail.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { FollowUp } from './follow-up.entity.js';

export interface Resolution {
  siteId: string;
  kinds: string[];
  sourceEntity: string;
  sourceIds: string[];
  /** The record whose change resolved them, and what happened, in words. */
  resolvedBy: { entity: string; id: string };
  note: string;
}

/**
 * Closes the open follow-ups a change in Decant resolved (the signed copy recorded, the check
 * done, the repeat sample taken), inside the caller's transaction: done, or done late past the
 * deadline, with a note naming what closed it, each in the trail. Answers how many it closed.
 */
export async function closeResolvedFollowUps(manager: EntityManager, actor: Actor, resolution: Resolution): Promise<number> {
  if (resolution.sourceIds.length === 0) return 0;
  const open = await manager
    .getRepository(FollowUp)
    .createQueryBuilder('f')
    .setLock('pessimistic_write')
    .where(
      `f.site_id = :siteId AND f.status = 'open' AND f.kind IN (:...kinds) AND f.source_entity = :entity AND f.source_id IN (:...ids)`,
      {
        siteId: resolution.siteId,
        kinds: resolution.kinds,
        entity: resolution.sourceEntity,
        ids: resolution.sourceIds,
      },
    )
    .getMany();
  for (const before of open) {
    await manager
      .createQueryBuilder()
      .update(FollowUp)
      .set({
        status: () => `CASE WHEN now() > due_at THEN 'done-late' ELSE 'done' END`,
        closedAt: () => 'now()',
        closingNote: `Closed by Decant: ${resolution.note}`,
        ownerId: actor.id ?? null,
        closedByEntity: resolution.resolvedBy.entity,
        closedById: resolution.resolvedBy.id,
      })
      .where('id = :id', { id: before.id })
      .execute();
    const after = await manager.findOneByOrFail(FollowUp, { id: before.id });
    await recordTrail(manager, actor, {
      action: 'close',
      entity: 'follow-up',
      entityId: before.id,
      siteId: before.siteId,
      before: { status: before.status, title: before.title },
      after: { status: after.status, closingNote: after.closingNote, closedBy: resolution.resolvedBy },
    });
  }
  return open.length;
}
