import type { DataSource, EntityManager } from 'typeorm';
import { DateTime } from 'luxon';
import {
  permitSettingNames,
  type CreateLimitRequest,
  type CreatePermitRequest,
  type EndLimitQuery,
  type PermitSettingsValues,
  type UpdateLimitRequest,
  type UpdatePermitRequest,
} from '../../contracts/setup.js';
import { settingsOn } from '../../domain/permit-settings.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import { uniquely } from '../../db/uniquely.js';
import { Permit } from './permit.entity.js';
import { PermitSettings } from './permit-settings.entity.js';
import { convert, isMassRate, units } from '../../domain/units.js';
import { conflict, invalid, notFound } from '../../errors/app-error.js';
import { createTraced, deleteTraced } from '../../kernel/trail/traced-writes.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { PermitLimit } from './permit-limit.entity.js';
import { recheckResultsAtPoint } from '../lab/lab-flags.service.js';
import { ensurePeriods } from '../periods/periods.service.js';
import {
  countKeptPeriods,
  countLimits,
  deleteUncompiledPeriods,
  findLimitForUpdate,
  findLimits,
  findParameter,
  findPermit,
  findPermits,
  findPoint,
  limitTarget,
  permitView,
  runningPeriodStart,
  settingsValues,
  settingsVersions,
} from './permits.repository.js';

const duplicateLimit = 'This permit already has this statistic for this point and parameter';

/** Permits of a site and their limits; a change re-checks the lab results the limits judge. */
export class PermitsService {
  constructor(private readonly dataSource: DataSource) {}

  list(user: CurrentUser, siteId: string | undefined) {
    if (siteId) assertSiteAllowed(user, siteId);
    return findPermits(this.dataSource, siteId ? [siteId] : user.siteIds);
  }

  async get(user: CurrentUser, id: string) {
    return permitView(this.dataSource, await this.visiblePermit(user, id));
  }

  /** A permit and its first settings version, applying from the permit's start. */
  create(user: CurrentUser, request: CreatePermitRequest) {
    assertSiteAllowed(user, request.siteId);
    const { settings, fields } = splitSettings(request);
    return uniquely(
      () =>
        this.dataSource.transaction(async (manager) => {
          const permit = await manager.save(Permit, manager.create(Permit, fields));
          await manager.insert(PermitSettings, { ...settings, permitId: permit.id, appliesFrom: permit.effectiveFrom });
          await ensurePeriods(manager, permit.id);
          const after = await permitView(manager, permit);
          await recordTrail(manager, user, { action: 'create', entity: 'permit', entityId: permit.id, siteId: permit.siteId, after });
          return after;
        }),
      'number',
      'This site already has a permit with this number',
    );
  }

  /**
   * Changed settings are the next settings version, from the day given (by default the start of
   * the running period); a change from the version's own first day corrects that version.
   * PostgreSQL refuses either where a signed period used the version (409 naming it).
   */
  async update(user: CurrentUser, id: string, request: UpdatePermitRequest) {
    const permit = await this.visiblePermit(user, id);
    const { settingsFrom, ...changes } = request;
    const { settings, fields } = splitSettings(changes);
    const from = settingsFrom ?? (await runningPeriodStart(this.dataSource, permit));
    const updated = await uniquely(
      () =>
        this.dataSource.transaction(async (manager) => {
          const before = await permitView(manager, permit);
          const effectiveFrom = fields.effectiveFrom ?? before.effectiveFrom;
          const effectiveTo = fields.effectiveTo === undefined ? before.effectiveTo : fields.effectiveTo;
          if (effectiveTo && effectiveTo < effectiveFrom) throw invalid({ effectiveTo: 'Ends before it starts' });
          if (Object.keys(fields).length > 0) await manager.update(Permit, { id }, fields);
          const versions = await settingsVersions(manager, id);
          const version = settingsOn(versions, from)!;
          const changed = Object.entries(settings).filter(
            ([key, value]) => value !== undefined && value !== (settingsValues(version) as Record<string, unknown>)[key],
          );
          if (changed.length > 0) {
            const next = Object.fromEntries(changed);
            if (from <= version.appliesFrom) {
              await manager.update(PermitSettings, { id: version.id }, next);
            } else {
              await manager.update(PermitSettings, { id: version.id }, { appliesTo: dayBefore(from) });
              const { id: _id, createdAt: _c, permit: _p, ...kept } = version;
              await manager.insert(PermitSettings, { ...kept, ...next, appliesFrom: from, appliesTo: version.appliesTo });
            }
          }
          const after = await permitView(manager, (await manager.findOneByOrFail(Permit, { id }))!);
          await recordTrail(manager, user, {
            action: 'update',
            entity: 'permit',
            entityId: id,
            siteId: permit.siteId,
            before,
            after: changed.length > 0 ? { ...after, settingsChangedFrom: from } : after,
          });
          return after;
        }),
      'number',
      'This site already has a permit with this number',
    );
    // New dates or a new frequency may add periods; existing ones stay as they were reported.
    await ensurePeriods(this.dataSource, id);
    return updated;
  }

  /**
   * Only a permit entered by mistake goes: no limits, no period compiled or sent. A permit that
   * judged anything is a kept record (40 CFR 403.12(o): at least 3 years) and ends instead.
   */
  async remove(user: CurrentUser, id: string): Promise<void> {
    const permit = await this.visiblePermit(user, id);
    await this.dataSource.transaction(async (manager) => {
      const before = await permitView(manager, permit);
      const kept = await countKeptPeriods(manager, id);
      if (kept > 0) {
        throw conflict(
          `Permit ${before.number} has ${kept} compiled or sent reporting period(s), which are kept records, so it cannot be deleted. ` +
            'End it instead: set its effective-to date to the last day it applied.',
          { effectiveTo: 'Set the last day this permit applied' },
        );
      }
      if ((await countLimits(manager, id)) > 0) {
        throw conflict(`Permit ${before.number} still has limits. End the permit with its effective-to date, or remove its limits first.`);
      }
      await deleteUncompiledPeriods(manager, id);
      await manager.delete(PermitSettings, { permitId: id });
      await manager.delete(Permit, { id });
      await recordTrail(manager, user, { action: 'delete', entity: 'permit', entityId: id, siteId: permit.siteId, before });
    });
  }

  async limits(user: CurrentUser, id: string) {
    const permit = await this.visiblePermit(user, id);
    return findLimits(this.dataSource, id, permit.siteId);
  }

  async createLimit(user: CurrentUser, id: string, request: CreateLimitRequest) {
    const permit = await this.visiblePermit(user, id);
    return uniquely(
      () =>
        createTraced(
          this.dataSource,
          user,
          limitTarget(permit.siteId),
          { ...request, permitId: permit.id },
          {
            check: (manager) => checkLimit(manager, permit, request),
            afterWrite: (manager) => recheckResultsAtPoint(manager, request.dischargePointId),
          },
        ),
      'statistic',
      duplicateLimit,
    );
  }

  /**
   * A change to a limit is its next version, applying from the day given (by default the start of
   * the running period); the version before ends the day before. A change from the version's
   * own first day corrects that version. PostgreSQL refuses either where a signed period would
   * be judged differently (409 naming it).
   */
  async updateLimit(user: CurrentUser, id: string, limitId: string, request: UpdateLimitRequest) {
    const permit = await this.visiblePermit(user, id);
    const target = limitTarget(permit.siteId);
    const { appliesFrom: requestedFrom, ...changes } = request;
    const appliesFrom = requestedFrom ?? (await runningPeriodStart(this.dataSource, permit));
    const updated = await uniquely(
      () =>
        this.dataSource.transaction(async (manager) => {
          const before = await findLimitForUpdate(manager, limitId);
          if (!before || before.permitId !== permit.id) throw notFound('Limit');
          if (before.appliesTo !== null && before.appliesTo < appliesFrom) {
            throw conflict(`This version ended on ${before.appliesTo}; change the version in force instead`);
          }
          await checkLimit(manager, permit, { ...target.view(before), ...changes });
          const written = Object.fromEntries(Object.entries(changes).filter(([, value]) => value !== undefined));
          let row: PermitLimit;
          if (appliesFrom <= before.appliesFrom) {
            await manager.update(PermitLimit, { id: before.id }, written);
            row = await manager.findOneByOrFail(PermitLimit, { id: before.id });
          } else {
            await manager.update(PermitLimit, { id: before.id }, { appliesTo: dayBefore(appliesFrom) });
            const { id: _id, createdAt: _c, updatedAt: _u, ...kept } = before;
            row = await manager.save(
              PermitLimit,
              manager.create(PermitLimit, { ...kept, ...written, appliesFrom, appliesTo: before.appliesTo, seriesId: before.seriesId }),
            );
            row = await manager.findOneByOrFail(PermitLimit, { id: row.id });
          }
          await recordTrail(manager, user, {
            action: row.id === before.id ? 'update' : 'new-version',
            entity: target.entity,
            entityId: row.id,
            siteId: permit.siteId,
            before: target.view(before),
            after: target.view(row),
          });
          await recheckResultsAtPoint(manager, row.dischargePointId);
          return target.view(row);
        }),
      'statistic',
      duplicateLimit,
    );
    return updated;
  }

  /**
   * A limit ends on a day (its version applies through it) and stays in the record. Only a limit
   * of a permit that judged nothing yet (entered by mistake) is deleted, when no end day is given.
   */
  async removeLimit(user: CurrentUser, id: string, limitId: string, { endsOn }: EndLimitQuery): Promise<void> {
    const permit = await this.visiblePermit(user, id);
    const target = limitTarget(permit.siteId);
    if (endsOn) {
      await this.dataSource.transaction(async (manager) => {
        const before = await findLimitForUpdate(manager, limitId);
        if (!before || before.permitId !== permit.id) throw notFound('Limit');
        if (endsOn < before.appliesFrom) throw invalid({ endsOn: `Before the version started (${before.appliesFrom})` });
        if (before.appliesTo !== null && before.appliesTo <= endsOn) throw conflict(`This version already ended on ${before.appliesTo}`);
        await manager.update(PermitLimit, { id: before.id }, { appliesTo: endsOn });
        const row = await manager.findOneByOrFail(PermitLimit, { id: before.id });
        await recordTrail(manager, user, {
          action: 'end',
          entity: target.entity,
          entityId: row.id,
          siteId: permit.siteId,
          before: target.view(before),
          after: target.view(row),
        });
        await recheckResultsAtPoint(manager, row.dischargePointId);
      });
      return;
    }
    let pointId = '';
    await deleteTraced(this.dataSource, user, target, limitId, async (manager, before) => {
      if (before.permitId !== permit.id) throw notFound('Limit');
      if ((await countKeptPeriods(manager, permit.id)) > 0) {
        throw conflict('This limit judged periods already compiled or sent, so it is kept: end it on a day instead (endsOn).', {
          endsOn: 'The last day the limit applies',
        });
      }
      pointId = before.dischargePointId;
    });
    await this.dataSource.transaction((manager) => recheckResultsAtPoint(manager, pointId));
  }

  private async visiblePermit(user: CurrentUser, id: string): Promise<Permit> {
    const permit = await findPermit(this.dataSource, id);
    assertSiteVisible(user, permit?.siteId, 'Permit');
    return permit!;
  }
}

/** A permit request's settings (versioned) apart from the permit's own fields. */
function splitSettings<R extends Partial<PermitSettingsValues>>(request: R) {
  const settings: Partial<PermitSettingsValues> = {};
  const fields: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(request)) {
    if ((permitSettingNames as string[]).includes(key)) Object.assign(settings, { [key]: value });
    else fields[key] = value;
  }
  return { settings, fields: fields as Omit<R, keyof PermitSettingsValues> & Partial<Permit> };
}

const dayBefore = (day: string) => DateTime.fromISO(day, { zone: 'UTC' }).minus({ days: 1 }).toISODate()!;

/** A limit's point must be of the permit's site, its parameter known there, its unit comparable. */
async function checkLimit(
  manager: EntityManager,
  permit: Permit,
  limit: { dischargePointId: string; parameterId: string; unit: string; statistic: string },
): Promise<void> {
  const point = await findPoint(manager, limit.dischargePointId);
  const parameter = await findParameter(manager, limit.parameterId);
  const fields: Record<string, string> = {};
  if (!point || point.siteId !== permit.siteId) fields.dischargePointId = 'Not a discharge point of this permit’s site';
  if (!parameter || (parameter.siteId && parameter.siteId !== permit.siteId)) fields.parameterId = 'Not a parameter of this site';
  else if (isMassRate(limit.unit)) {
    // A loading is computed from a concentration and the day's flow (40 CFR 122.45(f) mass limits).
    if (units[parameter.defaultUnit]?.dimension !== 'concentration')
      fields.unit = `${parameter.name} is not measured as a concentration, so it has no mass loading`;
    if (limit.statistic !== 'daily-maximum' && limit.statistic !== 'monthly-average')
      fields.statistic = 'A mass limit is a daily maximum or a monthly average';
  } else if (convert(1, limit.unit, parameter.defaultUnit) === null) {
    fields.unit = `Cannot be compared with ${parameter.name} (${parameter.defaultUnit})`;
  }
  if (Object.keys(fields).length > 0) throw invalid(fields);
}
