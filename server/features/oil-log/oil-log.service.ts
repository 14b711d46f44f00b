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
import { findEquipmentRating, findOilLogEntry, insertOilLogEntry, oilTotals, pageOilLog, updateOilLogEntry } from './oil-log.repository.js';

interface CollectingEquipment {
  id: string;
  siteId: string;
  ratedLph: number;
  active: boolean;
}

async function loadEquipment(manager: EntityManager, id: string, user: CurrentUser): Promise<CollectingEquipment> {
  const equipment = await findEquipmentRating(manager, id);
  if (!equipment || !user.siteIds.includes(equipment.siteId)) throw invalid({ equipmentId: 'No such equipment at your sites' });
  return { ...equipment, ratedLph: ratingLitresPerHour(equipment.ratedCapacity, equipment.ratedUnit) };
}

/** Checks what needs the database and returns the canonical litres and the entry's flags. */
async function checkEntry(
  manager: EntityManager,
  equipment: CollectingEquipment,
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
      const id = await insertOilLogEntry(manager, {
        equipmentId: equipment.id,
        siteId: equipment.siteId,
        collectedOn: request.collectedOn,
        volumeLitres: litres,
        enteredVolume: request.volume,
        enteredUnit: request.unit,
        hoursRun: request.hoursRun,
        waterTemperatureC: request.waterTemperatureC,
        observations: request.observations,
        note: request.note,
        flags,
        enteredBy: user.id,
      });
      const after = (await findOilLogEntry(manager, id))!;
      await recordTrail(manager, user, { action: 'create', entity: 'oil-log-entry', entityId: id, siteId: equipment.siteId, after });
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
      await updateOilLogEntry(manager, id, {
        collectedOn: merged.collectedOn,
        volumeLitres: litres,
        enteredVolume: merged.volume,
        enteredUnit: merged.unit,
        hoursRun: merged.hoursRun,
        waterTemperatureC: request.waterTemperatureC === undefined ? entry.waterTemperatureC : request.waterTemperatureC,
        observations: request.observations ?? entry.observations,
        note: request.note ?? entry.note,
        flags,
      });
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
