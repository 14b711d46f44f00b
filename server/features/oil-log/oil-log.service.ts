import type { DataSource, EntityManager } from 'typeorm';
import type { CreateOilLogRequest, OilLogEntryView, OilLogQuery, OilTotalsQuery, UpdateOilLogRequest } from '../../contracts/oil.js';
import { mayCorrectOilLogEntry } from '../../contracts/permissions.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { collectionFlags, physicallyPossible, ratingLitresPerHour } from '../../domain/oil-collection.js';
import { convert } from '../../domain/units.js';
import { forbidden, invalid, notFound } from '../../errors/app-error.js';
import { siteToday } from '../../kernel/site-today.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { findOilLogEntry, oilTotals, pageOilLog } from './oil-log.repository.js';

interface Equipment {
  id: string;
  siteId: string;
  ratedLph: number;
  active: boolean;
}

async function loadEquipment(manager: EntityManager, id: string, user: CurrentUser): Promise<Equipment> {
  const [row] = await manager.query('SELECT id, site_id, rated_capacity, rated_unit, active FROM equipment WHERE id = $1', [id]);
  if (!row || !user.siteIds.includes(row.site_id)) throw invalid({ equipmentId: 'No such equipment at your sites' });
  return { id: row.id, siteId: row.site_id, ratedLph: ratingLitresPerHour(Number(row.rated_capacity), row.rated_unit), active: row.active };
}

/** Checks what needs the database and returns the canonical litres and the entry's flags. */
async function checkEntry(
  manager: EntityManager,
  equipment: Equipment,
  entry: { collectedOn: string; volume: number; unit: 'gal' | 'L'; hoursRun: number | null },
) {
  const litres = convert(entry.volume, entry.unit, 'L')!;
  const fields: Record<string, string> = {};
  if (entry.collectedOn > (await siteToday(manager, equipment.siteId))) fields.collectedOn = 'Cannot be in the future';
  if (!physicallyPossible(litres, equipment.ratedLph)) {
    fields.volume = `More than this equipment can remove in 24 hours at its rating (${(equipment.ratedLph * 24).toFixed(0)} L)`;
  }
  if (Object.keys(fields).length > 0) throw invalid(fields);
  return { litres, flags: collectionFlags(litres, entry.hoursRun, equipment.ratedLph) };
}

export class OilLogService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser, query: OilLogQuery) {
    if (query.siteId) assertSiteAllowed(user, query.siteId);
    return pageOilLog(this.dataSource, query.siteId ? [query.siteId] : user.siteIds, query);
  }

  async totals(user: CurrentUser, query: OilTotalsQuery) {
    assertSiteAllowed(user, query.siteId);
    return { by: query.by, items: await oilTotals(this.dataSource, query.siteId, query.by, query) };
  }

  async get(user: CurrentUser, id: string): Promise<OilLogEntryView> {
    const entry = await findOilLogEntry(this.dataSource, id);
    assertSiteVisible(user, entry?.siteId, 'Oil log entry');
    return entry!;
  }

  async create(user: CurrentUser, request: CreateOilLogRequest): Promise<OilLogEntryView> {
    return this.dataSource.transaction(async (manager) => {
      const equipment = await loadEquipment(manager, request.equipmentId, user);
      if (!equipment.active) throw invalid({ equipmentId: 'This equipment is retired' });
      const { litres, flags } = await checkEntry(manager, equipment, request);
      const [row] = await manager.query(
        `INSERT INTO oil_log_entry (equipment_id, site_id, collected_on, volume_litres, entered_volume, entered_unit, hours_run,
           water_temperature_c, observations, note, flags, entered_by)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12) RETURNING id`,
        [
          equipment.id,
          equipment.siteId,
          request.collectedOn,
          litres,
          request.volume,
          request.unit,
          request.hoursRun,
          request.waterTemperatureC,
          request.observations,
          request.note,
          JSON.stringify(flags),
          user.id,
        ],
      );
      const after = (await findOilLogEntry(manager, row.id))!;
      await recordTrail(manager, user, { action: 'create', entity: 'oil-log-entry', entityId: row.id, siteId: equipment.siteId, after });
      return after;
    });
  }

  /**
   * An operator may correct their own entry for 24 hours; after that only a coordinator can,
   * and must say why. The trail keeps before, after and the reason.
   */
  async update(user: CurrentUser, id: string, request: UpdateOilLogRequest, now = new Date()): Promise<OilLogEntryView> {
    return this.dataSource.transaction(async (manager) => {
      const before = await findOilLogEntry(manager, id);
      assertSiteVisible(user, before?.siteId, 'Oil log entry');
      const entry = before!;
      const decision = mayCorrectOilLogEntry(user, entry, now);
      if (!decision.allowed) throw forbidden(decision.refusal);
      if (decision.reasonRequired && !request.reason) throw invalid({ reason: 'Say why an entry older than 24 hours changes' });
      const merged = {
        collectedOn: request.collectedOn ?? entry.collectedOn,
        volume: request.volume ?? entry.enteredVolume,
        unit: request.unit ?? entry.enteredUnit,
        hoursRun: request.hoursRun === undefined ? entry.hoursRun : request.hoursRun,
      };
      const equipment = await loadEquipment(manager, entry.equipmentId, user);
      const { litres, flags } = await checkEntry(manager, equipment, merged);
      await manager.query(
        `UPDATE oil_log_entry SET collected_on = $2, volume_litres = $3, entered_volume = $4, entered_unit = $5, hours_run = $6,
           water_temperature_c = $7, observations = $8, note = $9, flags = $10, updated_at = now() WHERE id = $1`,
        [
          id,
          merged.collectedOn,
          litres,
          merged.volume,
          merged.unit,
          merged.hoursRun,
          request.waterTemperatureC === undefined ? entry.waterTemperatureC : request.waterTemperatureC,
          request.observations ?? entry.observations,
          request.note ?? entry.note,
          JSON.stringify(flags),
        ],
      );
      const after = await findOilLogEntry(manager, id);
      if (!after) throw notFound('Oil log entry');
      await recordTrail(manager, user, {
        action: 'update',
        entity: 'oil-log-entry',
        entityId: id,
        siteId: entry.siteId,
        before: entry,
        after: { ...after, reason: request.reason ?? null },
      });
      return after;
    });
  }
}
