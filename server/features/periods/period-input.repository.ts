import type { PeriodStatus } from '../../contracts/periods.js';
import type { DataSource, EntityManager } from 'typeorm';
import { sncWindows } from '../../domain/period/significant-noncompliance.js';
import type { LimitInput, Measurement, PeriodInput, PermitSettings } from '../../domain/period/types.js';
import { queryArrays } from '../../db/array-rows.js';
import { inParallel } from '../../db/in-parallel.js';
import { labFindingCodes } from '../../domain/lab-checks.js';
import { convert, measuredUnitFor } from '../../domain/units.js';

// Raw SQL throughout: a period's inputs are read set-based, tens of thousands of rows at a time.
interface LimitRow {
  id: string;
  discharge_point_id: string;
  point_code: string;
  parameter_id: string;
  parameter_name: string;
  parameter_code: string;
  snc_review_factor: string | null;
  fraction: string | null;
  reported_decimals: number | null;
  statistic: LimitInput['statistic'];
  value: string;
  unit: string;
  frequency_count: number;
  frequency_per: LimitInput['frequencyPer'];
  applies_from: string;
  applies_to: string | null;
}

interface FlowRow {
  id: string;
  discharge_point_id: string;
  day: string;
  value: string;
  unit: string;
}

type Db = DataSource | EntityManager;

export interface PeriodRecord {
  id: string;
  permitId: string;
  siteId: string;
  timeZone: string;
  startsOn: string;
  endsOn: string;
  dueOn: string;
  status: PeriodStatus;
  permitKind: 'pretreatment' | 'npdes';
  permitNumber: string;
  /** How the permit says its figures are worked out, read with the period. */
  settings: PermitSettings;
  lateReportDays: number;
  submittedOn: string | null;
  /** Signed revisions so far. */
  revision: number;
  /** The site's today, read with the period so no caller asks again. */
  today: string;
}

/** A row of the results read, in the order of its SELECT list. */
type ResultRow = [
  id: string,
  certificateId: string,
  point: number,
  parameter: number,
  day: string,
  qualifier: string | null,
  value: string,
  unit: string,
  mdl: string | null,
  ml: string | null,
  hasFinding: boolean,
];

/** A decimal from the database in the target unit; null when absent or not convertible. */
function inUnit(text: string | null, unit: string, target: string): number | null {
  if (text === null) return null;
  return unit === target ? Number(text) : convert(Number(text), unit, target);
}

/**
 * Reads what one period's summary needs, and only that: the permit's limits, and the results
 * and flows at its points from the start of the earliest six-month window to the period's end
 * (through the point/day indexes), each in the base unit of what is measured.
 */
export async function loadPeriodInput(db: Db, period: PeriodRecord): Promise<PeriodInput> {
  const windows = sncWindows({ start: period.startsOn, end: period.endsOn }, period.settings.sncWindow);
  const from = [period.startsOn, ...windows.map((w) => w.start)].sort()[0]!;
  // The limit versions in force on any day from the earliest six-month window to the period's end.
  const limitRows: LimitRow[] = await db.query(
    `SELECT l.*, l.applies_from::text AS applies_from, l.applies_to::text AS applies_to,
            d.code AS point_code, p.name AS parameter_name, p.code AS parameter_code, p.snc_review_factor, p.fraction
       FROM permit_limit l JOIN discharge_point d ON d.id = l.discharge_point_id JOIN parameter p ON p.id = l.parameter_id
      WHERE l.permit_id = $1 AND l.applies_from <= $3 AND (l.applies_to IS NULL OR l.applies_to >= $2)
      ORDER BY d.code, p.name, l.statistic, l.applies_from`,
    [period.permitId, from, period.endsOn],
  );
  const limits: LimitInput[] = limitRows.map((row) => ({
    id: row.id,
    dischargePointId: row.discharge_point_id,
    pointCode: row.point_code,
    parameterId: row.parameter_id,
    parameterName: row.parameter_name,
    sncReviewFactor: row.snc_review_factor === null ? null : Number(row.snc_review_factor),
    isPollutant: row.parameter_code !== 'flow',
    method1664: row.fraction !== null,
    reportedDecimals: row.reported_decimals,
    statistic: row.statistic,
    value: Number(row.value),
    unit: row.unit,
    frequencyCount: row.frequency_count,
    frequencyPer: row.frequency_per,
    appliesFrom: row.applies_from,
    appliesTo: row.applies_to,
  }));
  const pointIds = [...new Set(limits.map((l) => l.dischargePointId))];
  const parameterIds = [...new Set(limits.map((l) => l.parameterId))];
  // Each result is carried in the base unit of what its limits measure (a mass limit measures a concentration),
  // looked up by the point's and the parameter's place in the id arrays.
  const measuredUnits = pointIds.map(() => parameterIds.map((): string | null => null));
  for (const l of limits)
    measuredUnits[pointIds.indexOf(l.dischargePointId)]![parameterIds.indexOf(l.parameterId)] = measuredUnitFor(l.unit);

  // Points and parameters come back as their place in the id arrays, and an MDL/ML only for a
  // non-detect (the only place it is used): tens of thousands of rows carry less that way.
  const [results, flowRows] = await inParallel(
    db,
    () =>
      queryArrays(
        db,
        `SELECT r.id, s.certificate_id, array_position($1::uuid[], s.discharge_point_id) - 1, array_position($2::uuid[], r.parameter_id) - 1,
              s.collected_on::text, r.qualifier, r.value, r.unit, CASE WHEN r.qualifier = '<' THEN r.mdl END, r.ml,
              r.flag_codes && $5::text[] OR EXISTS (SELECT 1 FROM jsonb_array_elements(s.flags) f WHERE f->>'code' = ANY($5::text[]))
         FROM lab_sample s JOIN lab_result r ON r.sample_id = s.id
        WHERE s.discharge_point_id = ANY($1::uuid[]) AND r.parameter_id = ANY($2::uuid[]) AND s.collected_on BETWEEN $3 AND $4`,
        [pointIds, parameterIds, from, period.endsOn, labFindingCodes],
      ),
    (): Promise<FlowRow[]> =>
      db.query(
        `SELECT id, discharge_point_id, day::text AS day, value, unit FROM flow_reading WHERE discharge_point_id = ANY($1::uuid[]) AND day BETWEEN $2 AND $3`,
        [pointIds, from, period.endsOn],
      ),
  );
  const measurements: Measurement[] = [];
  for (const [resultId, certificateId, point, parameter, day, qualifier, value, unit, mdl, ml, hasFinding] of results as ResultRow[]) {
    const target = measuredUnits[point]?.[parameter];
    if (!target) continue;
    const measured = inUnit(value, unit, target);
    if (measured === null) continue;
    measurements.push({
      resultId,
      certificateId,
      dischargePointId: pointIds[point]!,
      parameterId: parameterIds[parameter]!,
      day,
      qualifier: qualifier === '<' ? '<' : null,
      value: measured,
      mdl: inUnit(mdl, unit, target),
      ml: inUnit(ml, unit, target),
      hasFinding,
    });
  }

  const flows = flowRows.map((row) => ({
    dischargePointId: row.discharge_point_id,
    day: row.day,
    mgd: convert(Number(row.value), row.unit, 'MGD')!,
  }));
  // Flow limits are checked against the flow readings themselves.
  const flowParametersAt = new Map<string, string[]>();
  for (const limit of limits.filter((l) => !l.isPollutant)) {
    const parameters = flowParametersAt.get(limit.dischargePointId) ?? [];
    if (!parameters.includes(limit.parameterId)) flowParametersAt.set(limit.dischargePointId, [...parameters, limit.parameterId]);
  }
  flowRows.forEach((row, i) => {
    for (const parameterId of flowParametersAt.get(row.discharge_point_id) ?? []) {
      measurements.push({
        resultId: row.id,
        certificateId: '',
        dischargePointId: row.discharge_point_id,
        parameterId,
        day: row.day,
        qualifier: null,
        value: flows[i]!.mgd,
        mdl: null,
        ml: null,
      });
    }
  });
  return {
    permit: period.settings,
    period: { start: period.startsOn, end: period.endsOn, asOf: period.today },
    limits,
    measurements,
    flows,
  };
}
