import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { Limit, Permit as PermitContract, PermitSettingsValues } from '../../contracts/setup.js';
import { settingsOn } from '../../domain/permit-settings.js';
import { siteToday } from '../../kernel/site-today.js';
import type { Target } from '../../kernel/trail/traced-writes.js';
import { DischargePoint } from '../discharge-points/discharge-point.entity.js';
import { Parameter } from '../parameters/parameter.entity.js';
import { ReportingPeriod } from '../periods/reporting-period.entity.js';
import { PermitLimit } from './permit-limit.entity.js';
import { PermitSettings } from './permit-settings.entity.js';
import { Permit } from './permit.entity.js';

type Db = DataSource | EntityManager;
export type LimitView = Limit;

export type PermitView = PermitContract & { siteId: string };

/** The permit with the settings in force on its site's today. */
export async function permitView(db: Db, permit: Permit): Promise<PermitView> {
  const versions = await settingsVersions(db, permit.id);
  const current = settingsOn(versions, await siteToday(db, permit.siteId))!;
  return {
    id: permit.id,
    siteId: permit.siteId,
    kind: permit.kind,
    number: permit.number,
    issuingAuthority: permit.issuingAuthority,
    authorityEmail: permit.authorityEmail,
    effectiveFrom: permit.effectiveFrom,
    effectiveTo: permit.effectiveTo,
    reportingFrequency: permit.reportingFrequency,
    reportDueDays: permit.reportDueDays,
    ...settingsValues(current),
    settingsFrom: current.appliesFrom,
  };
}

export const settingsValues = (version: PermitSettings): PermitSettingsValues => ({
  nonDetectPolicy: version.nonDetectPolicy,
  dailyMaxAppliesToEachGrab: version.dailyMaxAppliesToEachGrab,
  massLoadingFactor: version.massLoadingFactor as PermitSettingsValues['massLoadingFactor'],
  sncWindow: version.sncWindow,
  lateReportDays: version.lateReportDays,
  monitoringCounts: version.monitoringCounts,
});

export const settingsVersions = (db: Db, permitId: string) =>
  db.getRepository(PermitSettings).find({ where: { permitId }, order: { appliesFrom: 'ASC' } });

/** A limit belongs to a permit; its trail entries carry the permit's site. */
export const limitTarget = (siteId: string) =>
  ({
    entityClass: PermitLimit,
    entity: 'limit',
    view: (row: PermitLimit): LimitView => ({
      id: row.id,
      permitId: row.permitId,
      dischargePointId: row.dischargePointId,
      parameterId: row.parameterId,
      statistic: row.statistic,
      value: row.value,
      unit: row.unit,
      frequencyCount: row.frequencyCount,
      frequencyPer: row.frequencyPer,
      sampleType: row.sampleType,
      reportedDecimals: row.reportedDecimals,
      appliesFrom: row.appliesFrom,
      appliesTo: row.appliesTo,
      seriesId: row.seriesId,
    }),
    siteIdOf: () => siteId,
  }) satisfies Target<PermitLimit, LimitView>;

export async function findPermits(db: Db, siteIds: string[]) {
  const rows = await db
    .getRepository(Permit)
    .createQueryBuilder('permit')
    .where('permit.siteId = ANY(:siteIds)', { siteIds })
    .orderBy('permit.effectiveFrom', 'DESC')
    .getMany();
  return Promise.all(rows.map((row) => permitView(db, row)));
}

export const findPermit = (db: Db, id: string) => db.getRepository(Permit).findOneBy({ id });

export async function findLimits(db: Db, permitId: string, siteId: string): Promise<LimitView[]> {
  const rows = await db
    .getRepository(PermitLimit)
    .createQueryBuilder('limit')
    .innerJoin('limit.dischargePoint', 'point')
    .where('limit.permitId = :permitId', { permitId })
    .orderBy('point.code')
    .addOrderBy('limit.parameterId')
    .addOrderBy('limit.statistic')
    .addOrderBy('limit.appliesFrom')
    .getMany();
  return rows.map(limitTarget(siteId).view);
}

/**
 * How many of a permit's periods are kept records: compiled, signed, amended or sent. Only a
 * permit without any (entered by mistake) may be deleted.
 */
export async function countKeptPeriods(manager: EntityManager, permitId: string): Promise<number> {
  return manager
    .getRepository(ReportingPeriod)
    .createQueryBuilder('period')
    .where('period.permitId = :permitId', { permitId })
    .andWhere("(period.status <> 'open' OR period.compiledAt IS NOT NULL OR period.submittedOn IS NOT NULL)")
    .getCount();
}

/** The calendar's never-compiled periods of a permit entered by mistake: they hold nothing of their own. */
export async function deleteUncompiledPeriods(manager: EntityManager, permitId: string): Promise<void> {
  await manager.delete(ReportingPeriod, { permitId, status: 'open', compiledAt: IsNull(), submittedOn: IsNull() });
}

export const countLimits = (manager: EntityManager, permitId: string) => manager.countBy(PermitLimit, { permitId });

export const findPoint = (manager: EntityManager, id: string) => manager.findOneBy(DischargePoint, { id });
export const findParameter = (manager: EntityManager, id: string) => manager.findOneBy(Parameter, { id });

/** The first day of the permit's period running today, or the permit's start before any: where a change applies from by default. */
export async function runningPeriodStart(db: Db, permit: Permit): Promise<string> {
  // Raw SQL: the site's today is worked out in its own time zone.
  const [row]: Array<{ starts_on: string }> = await db.query(
    `SELECT rp.starts_on::text FROM reporting_period rp JOIN permit p ON p.id = rp.permit_id JOIN site s ON s.id = p.site_id
      WHERE rp.permit_id = $1 AND (now() AT TIME ZONE s.time_zone)::date BETWEEN rp.starts_on AND rp.ends_on`,
    [permit.id],
  );
  return row?.starts_on ?? permit.effectiveFrom;
}

export const findLimitForUpdate = (manager: EntityManager, id: string) =>
  manager.getRepository(PermitLimit).findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
