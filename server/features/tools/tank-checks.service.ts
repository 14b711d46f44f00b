import type { DataSource } from 'typeorm';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteAllowed, assertSiteVisible } from '../../auth/site-access.js';
import type { SaveTankCheckRequest, SavedTankCheck, TankCheckStart } from '../../contracts/tools.js';
import { tankCheckFromSheet } from '../../domain/application-sheet.js';
import { conflict, invalid } from '../../errors/app-error.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { findEquipmentSiteId } from '../equipment/equipment.repository.js';
import { currentSheets } from './application-sheets.repository.js';
import { tankCheck } from './tank-check.service.js';
import { attachTankCheck, equipmentAt, findFollowUpRef, findTankCheck, insertTankCheck, listTankChecks } from './tank-checks.repository.js';

/** Tank checks kept as dated records: computed again on save (the client's figures are never stored), listed, attached as evidence. */
export class TankChecksService {
  constructor(private readonly dataSource: DataSource) {}

  /** What to pre-fill: the equipment's sheet, or the sheets of the equipment at the point of a follow-up's result. */
  async start(user: CurrentUser, query: { equipmentId?: string; followUpId?: string }): Promise<TankCheckStart> {
    const followUp = query.followUpId ? await findFollowUpRef(this.dataSource, query.followUpId) : null;
    if (query.followUpId) assertSiteVisible(user, followUp?.siteId, 'Follow-up');
    const siteId = followUp?.siteId ?? (await findEquipmentSiteId(this.dataSource, query.equipmentId!));
    assertSiteVisible(user, siteId, 'Equipment');
    const pointCode = followUp?.facts?.pointCode ?? null;
    let equipment = await equipmentAt(this.dataSource, siteId!, { pointCode, id: query.equipmentId });
    // A follow-up whose point has no equipment linked: offer the site's, so the person can choose.
    if (equipment.length === 0 && !query.equipmentId) equipment = await equipmentAt(this.dataSource, siteId!);
    const sheets = await currentSheets(
      this.dataSource,
      equipment.map((item) => item.id),
    );
    return {
      siteId: siteId!,
      followUp: followUp ? { id: followUp.id, title: followUp.title, pointCode } : null,
      equipment: equipment.map((item) => {
        const sheet = sheets.get(item.id);
        return { id: item.id, name: item.name, kind: item.kind, input: sheet ? tankCheckFromSheet(sheet.content) : null };
      }),
    };
  }

  async save(user: CurrentUser, request: SaveTankCheckRequest): Promise<SavedTankCheck> {
    assertSiteAllowed(user, request.siteId);
    return this.dataSource.transaction(async (manager) => {
      if (request.equipmentId && (await findEquipmentSiteId(manager, request.equipmentId)) !== request.siteId) {
        throw invalid({ equipmentId: 'No such equipment at this site' });
      }
      if (request.followUpId && (await findFollowUpRef(manager, request.followUpId))?.siteId !== request.siteId) {
        throw invalid({ followUpId: 'No such follow-up at this site' });
      }
      const result = tankCheck(request.input);
      const saved = await insertTankCheck(manager, {
        siteId: request.siteId,
        equipmentId: request.equipmentId,
        followUpId: request.followUpId,
        input: request.input,
        result,
        verdict: result.verdict,
        checkedBy: user.id,
      });
      await recordTrail(manager, user, {
        action: 'create',
        entity: 'tank-check',
        entityId: saved.id,
        siteId: request.siteId,
        after: {
          equipment: saved.equipmentName,
          followUp: saved.followUpTitle,
          input: request.input,
          verdict: result.verdict,
          summary: result.summary,
        },
      });
      return saved;
    });
  }

  async list(user: CurrentUser, query: { equipmentId?: string; followUpId?: string }): Promise<{ items: SavedTankCheck[] }> {
    if (query.followUpId) assertSiteVisible(user, (await findFollowUpRef(this.dataSource, query.followUpId))?.siteId, 'Follow-up');
    if (query.equipmentId) assertSiteVisible(user, await findEquipmentSiteId(this.dataSource, query.equipmentId), 'Equipment');
    return { items: await listTankChecks(this.dataSource, query) };
  }

  /** Attaches a kept check to a follow-up of its site as evidence; once. */
  async attach(user: CurrentUser, id: string, followUpId: string): Promise<SavedTankCheck> {
    return this.dataSource.transaction(async (manager) => {
      const check = await findTankCheck(manager, id);
      assertSiteVisible(user, check?.siteId, 'Tank check');
      assertSiteAllowed(user, check!.siteId);
      if ((await findFollowUpRef(manager, followUpId))?.siteId !== check!.siteId)
        throw invalid({ followUpId: 'No such follow-up at this site' });
      if (check!.followUpId === followUpId) return check!;
      if (check!.followUpId) throw conflict('This check is already evidence of another follow-up: run and save it again for this one');
      await attachTankCheck(manager, id, followUpId);
      const after = (await findTankCheck(manager, id))!;
      await recordTrail(manager, user, {
        action: 'attach',
        entity: 'tank-check',
        entityId: id,
        siteId: check!.siteId,
        before: { followUp: null },
        after: { followUp: after.followUpTitle, followUpId },
      });
      return after;
    });
  }

  async get(user: CurrentUser, id: string): Promise<SavedTankCheck> {
    const check = await findTankCheck(this.dataSource, id);
    assertSiteVisible(user, check?.siteId, 'Tank check');
    return check!;
  }
}
