import { DateTime } from 'luxon';
import type { EntityManager } from 'typeorm';
import { compileWithin, ensurePeriods } from '../../features/periods/periods.service.js';
import { seedActor } from './seed-trail.js';

/** Daily flows at each outfall, then every period compiled once, so the demo's follow-ups exist on first start. */
export async function seedFlowsAndPeriods(
  manager: EntityManager,
  sites: Array<{ id: string; timeZone: string; outfall: string; gallonsPerDay: number }>,
  coordinator: { id: string; email: string },
  today = DateTime.now(),
): Promise<void> {
  for (const site of sites) {
    const [point] = await manager.query('SELECT id FROM discharge_point WHERE site_id = $1 AND code = $2', [site.id, site.outfall]);
    const end = today.setZone(site.timeZone).startOf('day').minus({ days: 1 });
    const days: string[] = [];
    const values: number[] = [];
    for (let day = end.startOf('month').minus({ months: 17 }); day <= end; day = day.plus({ days: 1 })) {
      if (day.weekday > 5) continue;
      days.push(day.toISODate()!);
      values.push(Math.round(site.gallonsPerDay * (0.8 + ((day.ordinal * 17) % 40) / 100)));
    }
    await manager.query(
      `INSERT INTO flow_reading (discharge_point_id, day, value, unit) SELECT $1, * , 'gal/day' FROM unnest($2::date[], $3::numeric[])
       ON CONFLICT (discharge_point_id, day) DO NOTHING`,
      [point.id, days, values],
    );
    for (const permit of await manager.query('SELECT id FROM permit WHERE site_id = $1', [site.id])) {
      await ensurePeriods(manager, permit.id);
      // Past reports went out a few days before they were due.
      await manager.query(
        `UPDATE reporting_period SET submitted_on = due_on - 3 WHERE permit_id = $1 AND due_on < $2 AND submitted_on IS NULL`,
        [permit.id, today.setZone(site.timeZone).toISODate()],
      );
      const periods = await manager.query(`SELECT id FROM reporting_period WHERE permit_id = $1 AND status = 'open' ORDER BY starts_on`, [
        permit.id,
      ]);
      // Compiled by the seed, not credited to a person.
      for (const period of periods) await compileWithin(manager, { id: null, email: seedActor }, period.id);
    }
  }
  // Older obligations were met at the time; the recent ones are still open, as on a real site.
  // Only the follow-ups the seed's own compiles just opened at the demo sites.
  await manager.query(
    `UPDATE follow_up SET status = 'done', closed_at = due_at - interval '3 hours', owner_id = $1,
       closing_note = CASE kind WHEN 'repeat-sampling' THEN 'Resampled; result sent to the control authority'
                               ELSE 'Called and e-mailed the pretreatment office' END
      WHERE site_id = ANY($2) AND status = 'open' AND kind IN ('notify-control-authority', 'repeat-sampling')
        AND due_at < now() - interval '60 days'`,
    [coordinator.id, sites.map((site) => site.id)],
  );
}
