import type { DataSource } from 'typeorm';
import type { ApplicationSheetHistory, SaveApplicationSheetRequest } from '../../contracts/application-sheet.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { invalid, notFound } from '../../errors/app-error.js';
import type { Download } from '../../http/download.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { applicationSheetPdf } from '../../../reports/application-sheet-pdf.js';
import { findEquipmentSiteId } from '../equipment/equipment.repository.js';
import { appendSheetVersion, findSheetVersion, lockEquipment, sheetVersions } from './application-sheets.repository.js';
import { equipmentFacts } from './equipment-facts.repository.js';

export const TOOLS_CAUTION =
  'These are estimates, not an engineering design: confirm with the equipment maker and a qualified engineer. ' +
  'Before working on a tank, follow the site\u2019s lockout and confined-space rules and wear the protective equipment it requires. ' +
  'Local codes and the control authority govern.';

/** Each piece of equipment's application sheet: versions appended with a reason, each in the trail, printable for a vendor or engineer. */
export class ApplicationSheetsService {
  constructor(private readonly dataSource: DataSource) {}

  async history(user: CurrentUser, equipmentId: string): Promise<ApplicationSheetHistory> {
    assertSiteVisible(user, await findEquipmentSiteId(this.dataSource, equipmentId), 'Equipment');
    const versions = await sheetVersions(this.dataSource, equipmentId);
    return { current: versions[0] ?? null, versions, caution: TOOLS_CAUTION };
  }

  async save(user: CurrentUser, request: SaveApplicationSheetRequest): Promise<ApplicationSheetHistory> {
    await this.dataSource.transaction(async (manager) => {
      const equipment = await lockEquipment(manager, request.equipmentId);
      if (!equipment || !user.siteIds.includes(equipment.siteId)) throw invalid({ equipmentId: 'No such equipment at your sites' });
      const before = (await sheetVersions(manager, equipment.id))[0];
      if (before && request.reason.length < 3) throw invalid({ reason: 'Say what changed and why (at least 3 characters)' });
      const id = await appendSheetVersion(manager, {
        equipmentId: equipment.id,
        siteId: equipment.siteId,
        content: request.content,
        reason: request.reason,
        savedBy: user.id,
      });
      await recordTrail(manager, user, {
        action: before ? 'revise' : 'create',
        entity: 'application-sheet',
        entityId: id,
        siteId: equipment.siteId,
        before: before ? { version: before.version, content: before.content } : undefined,
        after: { equipment: equipment.name, version: (before?.version ?? 0) + 1, content: request.content, reason: request.reason },
      });
    });
    return this.history(user, request.equipmentId);
  }

  /** The printable sheet of one version, to hand to a vendor or an engineer. */
  async pdf(user: CurrentUser, id: string): Promise<Download> {
    const sheet = await findSheetVersion(this.dataSource, id);
    assertSiteVisible(user, sheet?.siteId, 'Application sheet');
    const facts = await equipmentFacts(this.dataSource, sheet!.equipmentId);
    if (!facts) throw notFound('Equipment');
    const bytes = await applicationSheetPdf(sheet!, facts, TOOLS_CAUTION);
    const slug = facts.name.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '');
    return { bytes, mediaType: 'application/pdf', fileName: `application-sheet-${slug}-v${sheet!.version}.pdf` };
  }
}
