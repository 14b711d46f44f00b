import type { DataSource, EntityManager } from 'typeorm';
import { FlowReadingRequest, type FlowImportReport, type FlowReadingQuery } from '../../contracts/flow-readings.js';
import type { SpreadsheetImportFields } from '../../contracts/imports.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed } from '../../auth/site-access.js';
import { invalid } from '../../errors/app-error.js';
import { rowErrors, spreadsheetRows } from '../../kernel/spreadsheets/spreadsheet-rows.js';
import { siteToday } from '../../kernel/site-today.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { findPointSiteId, pageFlowReadings, pointIdsByCode, upsertFlowReading } from './flow-readings.repository.js';

export const flowColumns = [{ key: 'discharge_point_code' }, { key: 'day' }, { key: 'value' }, { key: 'unit' }] as const;

/** Daily flow per discharge point, entered or imported from a spreadsheet; each write in the trail. */
export class FlowReadingsService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser, query: FlowReadingQuery) {
    assertSiteAllowed(user, query.siteId);
    return pageFlowReadings(this.dataSource, query);
  }

  async record(user: CurrentUser, reading: FlowReadingRequest): Promise<FlowReadingRequest> {
    await this.dataSource.transaction(async (manager) => {
      const siteId = await findPointSiteId(manager, reading.dischargePointId);
      if (!siteId || !user.siteIds.includes(siteId)) throw invalid({ dischargePointId: 'No such discharge point at your sites' });
      if (reading.day > (await siteToday(manager, siteId))) throw invalid({ day: 'Cannot be in the future' });
      await this.write(manager, user, siteId, reading);
    });
    return reading;
  }

  /** Spreadsheet import (discharge_point_code, day, value, unit): a dry run, then all rows or none. */
  async import(user: CurrentUser, fields: SpreadsheetImportFields, file: Express.Multer.File | undefined): Promise<FlowImportReport> {
    const { siteId, commit } = fields;
    assertSiteAllowed(user, siteId);
    const rows = await spreadsheetRows<string>(file, flowColumns);
    const points = await pointIdsByCode(this.dataSource, siteId);
    const today = await siteToday(this.dataSource, siteId);
    const readings: FlowReadingRequest[] = [];
    const errors: FlowImportReport['errors'] = [];
    let count = 0;
    for await (const { row, cells } of rows) {
      count += 1;
      const parsed = FlowReadingRequest.safeParse({
        dischargePointId: points.get(cells.discharge_point_code ?? '') ?? '00000000-0000-0000-0000-000000000000',
        day: cells.day,
        value: Number(cells.value),
        unit: cells.unit,
      });
      if (!points.has(cells.discharge_point_code ?? ''))
        errors.push({ row, column: 'discharge_point_code', message: 'No discharge point with this code at the site' });
      if (!parsed.success)
        for (const issue of parsed.error.issues) {
          const field = String(issue.path[0]);
          errors.push({ row, column: field === 'dischargePointId' ? 'discharge_point_code' : field, message: issue.message });
        }
      else if (parsed.data.day > today) errors.push({ row, column: 'day', message: 'Cannot be in the future' });
      else if (points.has(cells.discharge_point_code ?? '')) readings.push(parsed.data);
    }
    const report = { committed: false, rows: count, readings: readings.length, errors: errors.slice(0, 500) };
    if (commit !== 'true') return report;
    if (errors.length > 0) throw rowErrors(report);
    await this.dataSource.transaction(async (manager) => {
      for (const reading of readings) await this.write(manager, user, siteId, reading);
    });
    return { ...report, committed: true };
  }

  private async write(manager: EntityManager, user: CurrentUser, siteId: string, reading: FlowReadingRequest): Promise<void> {
    const { id, before } = await upsertFlowReading(manager, reading, user.id);
    await recordTrail(manager, user, {
      action: before ? 'update' : 'create',
      entity: 'flow-reading',
      entityId: id,
      siteId,
      before,
      after: reading,
    });
  }
}
