import type { Row } from '../../db/rows.js';

const isoDay = (value: unknown) => (value instanceof Date ? value.toISOString().slice(0, 10) : (value as string | null));

export const permitTarget = {
  table: 'permit',
  entity: 'permit',
  view: (row: Row) => ({
    id: row.id as string,
    siteId: row.siteId as string,
    kind: row.kind as 'pretreatment' | 'npdes',
    number: row.number as string,
    issuingAuthority: row.issuingAuthority as string,
    authorityEmail: (row.authorityEmail as string | null) ?? null,
    effectiveFrom: isoDay(row.effectiveFrom)!,
    effectiveTo: isoDay(row.effectiveTo) ?? null,
    reportingFrequency: row.reportingFrequency as string,
    reportDueDays: Number(row.reportDueDays),
    nonDetectPolicy: row.nonDetectPolicy as string,
    dailyMaxAppliesToEachGrab: row.dailyMaxAppliesToEachGrab as boolean,
    massLoadingFactor: Number(row.massLoadingFactor),
    sncWindow: row.sncWindow as string,
    lateReportDays: Number(row.lateReportDays),
  }),
  siteIdOf: (row: Row) => row.siteId as string,
};

export const limitTarget = (siteId: string) => ({
  table: 'permit_limit',
  entity: 'limit',
  view: (row: Row) => ({
    id: row.id as string,
    permitId: row.permitId as string,
    dischargePointId: row.dischargePointId as string,
    parameterId: row.parameterId as string,
    statistic: row.statistic as string,
    value: Number(row.value),
    unit: row.unit as string,
    frequencyCount: Number(row.frequencyCount),
    frequencyPer: row.frequencyPer as string,
    sampleType: row.sampleType as string,
    reportedDecimals: row.reportedDecimals === null || row.reportedDecimals === undefined ? null : Number(row.reportedDecimals),
  }),
  siteIdOf: () => siteId,
});
