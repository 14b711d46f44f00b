import type { EntityManager } from 'typeorm';
import { monitoringUnitsOf } from '../../domain/period/monitoring.js';
import type { Actor } from '../../kernel/trail/trail.js';
import { closeResolvedFollowUps } from '../follow-ups/close-resolved.js';
import { openFollowUpSources } from '../follow-ups/follow-ups.repository.js';
import { missedMonitoringSourceId } from './finding-ids.js';
import { periodsCovering } from './periods.repository.js';
import { summarise } from './summarise.js';

export interface SampleTaken {
  dischargePointId: string;
  parameterId: string;
  /** The day it was collected. */
  day: string;
}

/**
 * A sample that arrives late can bring a day, week, month or quarter up to the count the permit
 * asks for: its missed-sample follow-up then closes by itself. Whether the unit is still short is
 * decided by the period summary's own count (the same rule that opened it), recomputed only when
 * an open missed-sample follow-up could be answered by these samples.
 */
export async function closeTakenMissedSamples(
  manager: EntityManager,
  actor: Actor,
  siteId: string,
  samples: SampleTaken[],
  resolvedBy: { entity: string; id: string; note: string },
): Promise<number> {
  const candidates = new Set(
    samples.flatMap((sample) => monitoringUnitsOf(sample.day).map((unit) => missedMonitoringSourceId(sample, unit))),
  );
  const open = await openFollowUpSources(manager, siteId, 'missed-sample', 'missed-monitoring', [...candidates]);
  if (open.length === 0) return 0;
  const stillMissed = new Set<string>();
  for (const period of await periodsCovering(manager, siteId, [...new Set(samples.map((s) => s.day))])) {
    const summary = await summarise(manager, period);
    for (const row of summary.rows) {
      for (const missed of row.missedMonitoring) stillMissed.add(missedMonitoringSourceId(row, missed.unit));
    }
  }
  return closeResolvedFollowUps(manager, actor, {
    siteId,
    kinds: ['missed-sample'],
    sourceEntity: 'missed-monitoring',
    sourceIds: open.filter((id) => !stillMissed.has(id)),
    resolvedBy: { entity: resolvedBy.entity, id: resolvedBy.id },
    note: resolvedBy.note,
  });
}
