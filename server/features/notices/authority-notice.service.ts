import type { DataSource, EntityManager } from 'typeorm';
import { authorityNoticePdf } from '../../../reports/authority-notice-pdf.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { assertSiteVisible } from '../../auth/site-access.js';
import { noticeKinds, type NoticeDraftRequest, type NoticeView, type SendNoticeRequest } from '../../contracts/notices.js';
import { conflict, invalid, notFound } from '../../errors/app-error.js';
import { storeFile } from '../../kernel/files/stored-files.js';
import { queueMail, queueMailTo } from '../../kernel/mail/outbox.js';
import { siteRecipients } from '../../kernel/mail/recipients.js';
import { recordTrail } from '../../kernel/trail/trail.js';
import { closeWithNotice, loadNoticeContext, markNoticeSent, saveNoticeDraft, type NoticeContext } from './authority-notice.repository.js';
import { localTime } from './follow-up-mail.js';

/**
 * The notice of a violation to the control authority: drafted from the facts its follow-up
 * keeps, edited by a coordinator, sent once through the mail path with its PDF, then kept as sent;
 * sending closes the notice follow-up, on time or late.
 */
export class AuthorityNoticeService {
  constructor(private readonly dataSource: DataSource) {}

  async view(user: CurrentUser, followUpId: string): Promise<NoticeView> {
    return viewOf(await this.context(this.dataSource.manager, user, followUpId));
  }

  async saveDraft(user: CurrentUser, followUpId: string, draft: NoticeDraftRequest): Promise<NoticeView> {
    return this.dataSource.transaction(async (manager) => {
      const context = await this.context(manager, user, followUpId, true);
      if (context.notice?.status === 'sent') throw conflict('This notice was sent: it is kept as sent');
      const id = await saveNoticeDraft(manager, context, user.id, draft);
      await recordTrail(manager, user, {
        action: context.notice ? 'update' : 'create',
        entity: 'authority-notice',
        entityId: id,
        siteId: context.followUp.siteId,
        before: context.notice ? { cause: context.notice.cause, correctiveAction: context.notice.correctiveAction } : undefined,
        after: { ...draft, followUp: context.followUp.title },
      });
      return viewOf((await loadNoticeContext(manager, followUpId))!);
    });
  }

  async send(user: CurrentUser, followUpId: string, request: SendNoticeRequest): Promise<NoticeView> {
    return this.dataSource.transaction(async (manager) => {
      const context = await this.context(manager, user, followUpId, true);
      if (context.notice?.status === 'sent') throw conflict('This notice was sent already');
      const to = context.permit.authorityEmail;
      if (!to) {
        throw invalid(
          {
            to: `Permit ${context.permit.number} has no address for ${context.permit.authority}: save the draft and send it another way, or add the address to the permit`,
          },
          'No address to send to',
        );
      }
      if (context.followUp.status !== 'open') throw conflict('This follow-up is closed');
      const id = await saveNoticeDraft(manager, context, user.id, request);
      const sentAtLocal = localTime(new Date(), context.site.timeZone);
      const draft = { ...viewOf(context), ...request, to, status: 'sent' as const };
      const pdf = await authorityNoticePdf(draft, { at: sentAtLocal, byName: user.name });
      const fileName = `notice-${context.permit.number}-${context.followUp.facts.pointCode}-${context.followUp.facts.date}.pdf`.replace(
        /[^A-Za-z0-9._-]+/g,
        '-',
      );
      const file = await storeFile(manager, { buffer: pdf, originalname: fileName, size: pdf.length } as never, 'application/pdf', {
        userId: user.id,
        siteId: context.followUp.siteId,
        purpose: 'follow-up-evidence',
        owner: { entity: 'follow-up', id: followUpId },
      });
      const sentAt = await markNoticeSent(manager, id, { to, fileId: file.id, userId: user.id });
      const onTime = sentAt.getTime() <= context.followUp.dueAt.getTime();
      const subject = `Notice of a violation: ${context.site.name}, permit ${context.permit.number}, ${context.followUp.facts.parameter} at ${context.followUp.facts.pointCode}, ${context.followUp.facts.date}`;
      const lines = [
        `To ${context.permit.authority}:`,
        `${context.company} gives notice of a violation of permit ${context.permit.number} at ${context.site.name}: ${context.followUp.facts.parameter} at ${context.followUp.facts.pointCode} was ${context.followUp.facts.shownValue} ${context.followUp.facts.unit} on ${context.followUp.facts.date} against a limit of ${context.followUp.facts.limit} ${context.followUp.facts.unit}.`,
        `Cause: ${request.cause}`,
        `Corrective action: ${request.correctiveAction}`,
        request.repeatSampleOn ? `Repeat sample: ${request.repeatSampleOn}.` : 'Repeat sample: date to follow.',
        `The notice is attached as PDF. Sent by ${user.name}.`,
      ];
      const attachments = [{ fileId: file.id, fileName }];
      await queueMailTo(
        manager,
        {
          eventKey: `notice:${id}`,
          kind: 'violation',
          followUpId,
          content: { subject, lines, path: '/follow-ups', linkText: '', attachments },
        },
        to,
      );
      // The site's coordinators get a copy, with the record's link.
      await queueMail(
        manager,
        {
          eventKey: `notice-copy:${id}`,
          kind: 'violation',
          followUpId,
          content: {
            subject: `Sent: ${subject}`,
            lines: [`${user.name} sent this notice to ${to} ${onTime ? 'on time' : 'after the deadline'}.`, ...lines],
            path: `/follow-ups?siteId=${context.followUp.siteId}`,
            linkText: 'Open the follow-ups',
            attachments,
          },
        },
        await siteRecipients(manager, context.followUp.siteId, ['coordinator']),
      );
      const closed = await closeWithNotice(manager, followUpId, {
        note: `Notice sent to ${to} on ${sentAtLocal} (site time), ${onTime ? 'on time' : 'late'}`,
        fileId: file.id,
        userId: user.id,
        noticeId: id,
      });
      await recordTrail(manager, user, {
        action: 'send',
        entity: 'authority-notice',
        entityId: id,
        siteId: context.followUp.siteId,
        after: { to, ...request, file: { name: fileName, sha256: file.sha256 }, onTime },
      });
      await recordTrail(manager, user, {
        action: 'close',
        entity: 'follow-up',
        entityId: followUpId,
        siteId: context.followUp.siteId,
        before: { status: context.followUp.status },
        after: { status: closed.status, closingNote: closed.closingNote, closedBy: { entity: 'authority-notice', id } },
      });
      return viewOf((await loadNoticeContext(manager, followUpId))!);
    });
  }

  private async context(manager: EntityManager, user: CurrentUser, followUpId: string, lock = false): Promise<NoticeContext> {
    const context = await loadNoticeContext(manager, followUpId, lock);
    assertSiteVisible(user, context?.followUp.siteId, 'Follow-up');
    if (!(noticeKinds as readonly string[]).includes(context!.followUp.kind)) throw notFound('Notice');
    return context!;
  }
}

function viewOf(context: NoticeContext): NoticeView {
  const { followUp, notice } = context;
  const zone = context.site.timeZone;
  return {
    followUpId: followUp.id,
    status: notice?.status ?? 'new',
    to: notice?.toAddress ?? context.permit.authorityEmail,
    facts: {
      company: context.company,
      site: context.site.name,
      siteAddress: context.site.address,
      permitNumber: context.permit.number,
      authority: context.permit.authority,
      pointCode: followUp.facts.pointCode,
      parameter: followUp.facts.parameter,
      statistic: followUp.facts.statistic,
      date: followUp.facts.date,
      value: `${followUp.facts.shownValue} ${followUp.facts.unit}`,
      limit: followUp.facts.limit,
      unit: followUp.facts.unit,
      sampledAt: context.sampledAt,
      awareAt: followUp.awareAt ? localTime(followUp.awareAt, zone) : null,
      awareSource: followUp.awareSource,
      dueAt: localTime(followUp.dueAt, zone),
    },
    cause: notice?.cause ?? '',
    correctiveAction: notice?.correctiveAction ?? '',
    repeatSampleOn: notice?.repeatSampleOn ?? null,
    sentAt: notice?.sentAt ? localTime(notice.sentAt, zone) : null,
    sentByName: notice?.sentByName ?? null,
    onTime: notice?.sentAt ? notice.sentAt.getTime() <= followUp.dueAt.getTime() : null,
  };
}
