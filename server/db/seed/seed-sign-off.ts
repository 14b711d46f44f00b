import type { EntityManager } from 'typeorm';
import { findPeriod } from '../../features/periods/periods.repository.js';
import { compileWithin } from '../../features/periods/periods.service.js';
import { storedCompile } from '../../features/periods/sign-off.repository.js';
import { amendWithin, signWithin } from '../../features/periods/sign-off.service.js';

interface Signatory {
  id: string;
  email: string;
  name: string;
}

const title = 'EHS coordinator';

/** Signs the period's stored compile as the demo coordinator, with the statement and a note. */
async function signStoredCompile(manager: EntityManager, coordinator: Signatory, periodId: string): Promise<void> {
  const period = (await findPeriod(manager, periodId))!;
  const { summary } = await storedCompile(manager, periodId);
  await signWithin(manager, coordinator, period, {
    compiledAt: summary!.compiledAt,
    statementAccepted: true,
    acknowledged: true,
    acknowledgementNote: 'Reviewed the flagged results, missed samples and open follow-ups with the lab and the operators.',
    signerName: coordinator.name,
    signerTitle: title,
  });
}

/**
 * Every state on first start: the demo's finished periods signed by the demo coordinator, the
 * running ones left as drafts, and one period amended (revision 2, with its reason) after its
 * daily flows were re-read.
 */
export async function seedSignOff(manager: EntityManager, siteIds: string[], coordinator: Signatory): Promise<void> {
  const finished: Array<{ id: string; permit_id: string; point_id: string }> = await manager.query(
    `SELECT rp.id, rp.permit_id, (SELECT l.discharge_point_id FROM permit_limit l WHERE l.permit_id = p.id LIMIT 1) AS point_id
       FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id
      WHERE p.site_id = ANY($1) AND rp.ends_on < (now() AT TIME ZONE s.time_zone)::date AND rp.compiled_at IS NOT NULL
      ORDER BY p.site_id, rp.starts_on`,
    [siteIds],
  );
  for (const period of finished) await signStoredCompile(manager, coordinator, period.id);

  const amended = finished.at(-1);
  if (!amended?.point_id) return;
  const period = (await findPeriod(manager, amended.id))!;
  await amendWithin(manager, coordinator, period, {
    reason: 'The flow meter was recalibrated: the daily flows of the period were re-read from the totaliser log',
  });
  await manager.query(`UPDATE flow_reading SET value = round(value * 1.04, 4) WHERE discharge_point_id = $1 AND day BETWEEN $2 AND $3`, [
    amended.point_id,
    period.startsOn,
    period.endsOn,
  ]);
  await compileWithin(manager, coordinator, amended.id);
  await signStoredCompile(manager, coordinator, amended.id);
}
