import type { DataSource, EntityManager } from 'typeorm';
import { sncWindows } from '../../domain/period/significant-noncompliance.js';
import type { LimitInput, Measurement, PeriodInput } from '../../domain/period/types.js';
import { convert } from '../../domain/units.js';

type Db = DataSource | EntityManager;

export interface PeriodRecord {
  id: string;
  permitId: string;
  siteId: string;
  timeZone: string;
  startsOn: string;
  endsOn: string;
  dueOn: string;
  status: string;
  permitKind: 'pretreatment' | 'npdes';
  lateReportDays: number;
  submittedOn: string | null;
  /** The site's today, read with the period so no caller asks again. */
  today: string;
}

/**
 * Reads what one period's summary needs, and only that: the permit's limits, and the results
 * and flows at its points from the start of the earliest six-month window to the period's end
 * (through the point/day indexes), converted to each limit's unit.
 */
export async function loadPeriodInput(db: Db, period: PeriodRecord): Promise<PeriodInput> {
  const [permit] = await db.query('SELECT * FROM permit WHERE id = $1', [period.permitId]);
  const limitRows = await db.query(
    `SELECT l.*, d.code AS point_code, p.name AS parameter_name, p.code AS parameter_code, p.snc_review_factor
       FROM permit_limit l JOIN discharge_point d ON d.id = l.discharge_point_id JOIN parameter p ON p.id = l.parameter_id
      WHERE l.permit_id = $1 ORDER BY d.code, p.name, l.statistic`,
    [period.permitId],
  );
  const limits: LimitInput[] = limitRows.map((row: Record<string, any>) => ({
    id: row.id, dischargePointId: row.discharge_point_id, pointCode: row.point_code, parameterId: row.parameter_id, parameterName: row.parameter_name,
    sncReviewFactor: row.snc_review_factor === null ? null : Number(row.snc_review_factor), isPollutant: row.parameter_code !== 'flow',
    statistic: row.statistic, value: Number(row.value), unit: row.unit, frequencyCount: row.frequency_count, frequencyPer: row.frequency_per,
  }));
  const windows = sncWindows({ start: period.startsOn, end: period.endsOn }, permit.snc_window);
  const from = [period.startsOn, ...windows.map((w) => w.start)].sort()[0]!;
  const pointIds = [...new Set(limits.map((l) => l.dischargePointId))];
  const unitOf = new Map(limits.map((l) => [`${l.dischargePointId}|${l.parameterId}`, l.unit]));

  const results = await db.query(
    `SELECT r.id, s.certificate_id, s.discharge_point_id, r.parameter_id, s.collected_on::text AS day, r.qualifier, r.value, r.unit, r.mdl, r.ml
       FROM lab_sample s JOIN lab_result r ON r.sample_id = s.id
      WHERE s.discharge_point_id = ANY($1::uuid[]) AND s.collected_on BETWEEN $2 AND $3`,
    [pointIds, from, period.endsOn],
  );
  const measurements: Measurement[] = [];
  for (const row of results) {
    const target = unitOf.get(`${row.discharge_point_id}|${row.parameter_id}`);
    if (!target) continue;
    const value = convert(Number(row.value), row.unit, target);
    if (value === null) continue;
    const scale = (x: string | null) => (x === null ? null : convert(Number(x), row.unit, target));
    measurements.push({
      resultId: row.id, certificateId: row.certificate_id, dischargePointId: row.discharge_point_id, parameterId: row.parameter_id,
      day: row.day, qualifier: row.qualifier, value, mdl: scale(row.mdl), ml: scale(row.ml),
    });
  }

  const flowRows = await db.query(
    `SELECT id, discharge_point_id, day::text AS day, value, unit FROM flow_reading WHERE discharge_point_id = ANY($1::uuid[]) AND day BETWEEN $2 AND $3`,
    [pointIds, from, period.endsOn],
  );
  const flows = flowRows.map((row: Record<string, any>) => ({ dischargePointId: row.discharge_point_id, day: row.day, mgd: convert(Number(row.value), row.unit, 'MGD')! }));
  // Flow limits are checked against the flow readings themselves.
  const flowPairs = new Map(limits.filter((l) => !l.isPollutant).map((l) => [`${l.dischargePointId}|${l.parameterId}`, l]));
  for (const limit of flowPairs.values()) {
    for (const row of flowRows.filter((f: Record<string, any>) => f.discharge_point_id === limit.dischargePointId)) {
      measurements.push({
        resultId: row.id, certificateId: '', dischargePointId: row.discharge_point_id, parameterId: limit.parameterId, day: row.day,
        qualifier: null, value: convert(Number(row.value), row.unit, limit.unit)!, mdl: null, ml: null,
      });
    }
  }
  return {
    permit: {
      kind: permit.kind, nonDetectPolicy: permit.non_detect_policy, massLoadingFactor: Number(permit.mass_loading_factor),
      dailyMaxAppliesToEachGrab: permit.daily_max_applies_to_each_grab, sncWindow: permit.snc_window,
    },
    period: { start: period.startsOn, end: period.endsOn, asOf: period.today },
    limits,
    measurements,
    flows,
  };
}
