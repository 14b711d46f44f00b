import { DateTime } from 'luxon';
import { PDFParse } from 'pdf-parse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailInbox, type MailInbox } from '../../server/dev/mail-inbox.js';
import { openFollowUp } from '../../server/features/follow-ups/open-follow-up.js';
import { DIGEST_HOUR, queueDailyDigests } from '../../server/features/notices/daily-digest.js';
import { sweepDeadlines } from '../../server/features/notices/deadline-sweep.js';
import { deliverPendingMail, MAX_ATTEMPTS, type MailSettings } from '../../server/kernel/mail/deliver-mail.js';
import { queueMail } from '../../server/kernel/mail/outbox.js';
import { siteRecipients } from '../../server/kernel/mail/recipients.js';
import { createMailTransport } from '../../server/kernel/mail/transport.js';
import { unsubscribeToken } from '../../server/kernel/mail/unsubscribe-token.js';
import { certificateBody, demoIds } from '../fixtures/lab.js';
import { binary } from '../helpers/binary-body.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

// Ports of this suite's own mail inbox, apart from the ones `npm start` uses.
const SMTP_PORT = 4392;
const WEB_PORT = 4393;

/**
 * Notices by mail, read back from a real SMTP server with an inbox (maildev): the outbox is
 * written with the change that causes it and delivered by the delivery job, once per event and
 * recipient, delayed but never lost while SMTP is down.
 */
describe('notices by mail', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let coordinator: string;
  let inbox: MailInbox;
  let mail: MailSettings;
  let periodId: string;
  let permitId: string;

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
    inbox = await startMailInbox(SMTP_PORT, WEB_PORT);
    mail = {
      transport: createMailTransport(`smtp://127.0.0.1:${SMTP_PORT}`),
      from: 'Decant <no-reply@decant.test>',
      appUrl: 'http://app.test',
      secret: t.config.sessionSecret,
    };
    // What the demo seed queued is sent first, so each test reads only its own mail.
    while ((await deliverPendingMail(t.dataSource, mail)).sent > 0);

    const point = await request(t.app)
      .post(`/api/sites/${ids.north}/discharge-points`)
      .set('cookie', coordinator)
      .send({ code: 'OF-NT', name: 'Notice outfall', receiving: 'sewer' })
      .expect(201);
    const permit = await request(t.app)
      .post('/api/permits')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        kind: 'pretreatment',
        number: 'NT-0001',
        issuingAuthority: 'Basin Water Authority',
        effectiveFrom: '2026-02-01',
        reportingFrequency: 'monthly',
        reportDueDays: 28,
        nonDetectPolicy: 'zero',
      })
      .expect(201);
    permitId = permit.body.id;
    await request(t.app)
      .post(`/api/permits/${permit.body.id}/limits`)
      .set('cookie', coordinator)
      .send({
        dischargePointId: point.body.id,
        parameterId: ids.hem,
        statistic: 'daily-maximum',
        value: 20,
        unit: 'mg/L',
        frequencyCount: 1,
        frequencyPer: 'month',
        sampleType: 'grab',
      })
      .expect(201);
    const body = certificateBody(ids, { receivedOn: '2026-02-12' });
    body.samples[0]!.dischargePointId = point.body.id;
    body.samples[0]!.collectedAt = '2026-02-10T09:30';
    body.samples[0]!.results[0]!.value = '31';
    body.samples[0]!.results[0]!.analysedAt = '2026-02-11T10:00';
    await request(t.app).post('/api/lab-certificates').set('cookie', coordinator).send(body).expect(201);
    const periods = await request(t.app).get(`/api/periods?permitId=${permit.body.id}`).set('cookie', coordinator).expect(200);
    periodId = periods.body.items.find((p: { startsOn: string }) => p.startsOn === '2026-02-01').id;
  });
  afterAll(async () => {
    await inbox?.stop();
    await t.close();
  });

  const messagesAbout = async (text: string) => (await inbox.messages()).filter((m) => m.subject.includes(text));

  it('mails a violation to each coordinator of the site at once, and to nobody else', async () => {
    await request(t.app).post(`/api/periods/${periodId}/compile`).set('cookie', coordinator).expect(200);
    const coordinators = await siteRecipients(t.dataSource, ids.north, ['coordinator']);
    expect(coordinators.length).toBeGreaterThan(0);
    const { sent } = await deliverPendingMail(t.dataSource, mail);
    expect(sent).toBeGreaterThan(0);
    // 40 CFR 403.12(g)(2): the control authority is to be told within 24 hours of becoming aware.
    const violation = (await messagesAbout('OF-NT')).filter((m) => m.subject.startsWith('Violation'));
    expect(violation.map((m) => m.to[0]!.address).sort()).toEqual(coordinators.map((c) => c.email).sort());
    const [first] = violation;
    expect(first!.text).toContain('http://app.test/follow-ups?siteId=');
    expect(first!.text).toContain('over its permit limit');
    // RFC 2369 and RFC 8058: the way out is in the headers too, for the mail program's own button.
    const source = (await inbox.source(first!.id)).replace(/\r?\n[ \t]+/g, ' ');
    expect(source).toMatch(/^List-Unsubscribe: <http:\/\/app\.test\/api\/mail\/unsubscribe\?token=[\w.-]+>\r?$/m);
    expect(source).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click\r?$/m);
    // Compiling again opens nothing new and mails nobody again.
    await request(t.app).post(`/api/periods/${periodId}/compile`).set('cookie', coordinator).expect(200);
    await deliverPendingMail(t.dataSource, mail);
    expect((await messagesAbout('OF-NT')).filter((m) => m.subject.startsWith('Violation'))).toHaveLength(violation.length);
    // The follow-up shows its mail as sent.
    const list = await request(t.app)
      .get(`/api/follow-ups?siteId=${ids.north}&status=open&pageSize=100`)
      .set('cookie', coordinator)
      .expect(200);
    const notice = list.body.items.find(
      (f: { kind: string; title: string }) => f.kind === 'notify-control-authority' && f.title.includes('OF-NT'),
    );
    expect(notice.mail).toEqual({ sent: coordinators.length, pending: 0, failed: 0 });
    // One violation, one group: its repeat sampling follows its notice in the list, marked as part of it.
    const items = list.body.items as Array<{ id: string; kind: string; partOf: string | null }>;
    const at = items.findIndex((f) => f.id === notice.id);
    expect(items[at + 1]).toMatchObject({ kind: 'repeat-sampling', partOf: notice.id });
    expect(notice.partOf).toBeNull();
  });

  it('keeps mail while SMTP is down and delivers each once when it is back, however many deliver at once', async () => {
    const people = await siteRecipients(t.dataSource, ids.north, ['coordinator']);
    await inbox.stop();
    await t.dataSource.transaction((manager) =>
      queueMail(
        manager,
        {
          eventKey: 'test:smtp-down',
          kind: 'deadline',
          content: { subject: 'Outage test', lines: ['While SMTP was down'], path: '/follow-ups', linkText: 'Open' },
        },
        people,
      ),
    );
    const down = await deliverPendingMail(t.dataSource, mail);
    expect(down.sent).toBe(0);
    const [row] = await t.dataSource.query(
      `SELECT status, attempts, next_attempt_at > now() AS later, last_error FROM mail_outbox WHERE event_key = 'test:smtp-down' LIMIT 1`,
    );
    expect(row).toMatchObject({ status: 'pending', attempts: 1, later: true });
    expect(row.last_error).toBeTruthy();

    inbox = await startMailInbox(SMTP_PORT, WEB_PORT);
    await t.dataSource.query(`UPDATE mail_outbox SET next_attempt_at = now() WHERE event_key = 'test:smtp-down'`);
    // Two instances' delivery jobs at once: the row claim (SKIP LOCKED) lets each mail go once.
    const [a, b] = await Promise.all([deliverPendingMail(t.dataSource, mail), deliverPendingMail(t.dataSource, mail)]);
    expect(a.sent + b.sent).toBe(people.length);
    const received = await messagesAbout('Outage test');
    expect(received.map((m) => m.to[0]!.address).sort()).toEqual(people.map((p) => p.email).sort());

    // A mail refused on its last attempt is given up and shows on its follow-up as not delivered.
    await inbox.stop();
    const [target] = await t.dataSource.query(`SELECT id FROM follow_up WHERE site_id = $1 AND status = 'open' LIMIT 1`, [ids.north]);
    await t.dataSource.transaction((manager) =>
      queueMail(
        manager,
        {
          eventKey: 'test:given-up',
          kind: 'deadline',
          followUpId: target.id,
          content: { subject: 'Given-up test', lines: ['x'], path: '/', linkText: 'Open' },
        },
        people.slice(0, 1),
      ),
    );
    await t.dataSource.query(`UPDATE mail_outbox SET attempts = $1 - 1 WHERE event_key = 'test:given-up'`, [MAX_ATTEMPTS]);
    await deliverPendingMail(t.dataSource, mail);
    const [givenUp] = await t.dataSource.query(`SELECT status, attempts FROM mail_outbox WHERE event_key = 'test:given-up'`);
    expect(givenUp).toEqual({ status: 'failed', attempts: MAX_ATTEMPTS });
    const listed = await request(t.app)
      .get(`/api/follow-ups?siteId=${ids.north}&status=open&pageSize=100`)
      .set('cookie', coordinator)
      .expect(200);
    expect(listed.body.items.find((f: { id: string }) => f.id === target.id).mail.failed).toBeGreaterThanOrEqual(1);
    inbox = await startMailInbox(SMTP_PORT, WEB_PORT);
  });

  it('lists in the daily digest what is due and overdue at the person’s own sites, at 07:00 their time', async () => {
    // 07:00 today at the sites (the demo's are all in one zone), the hour the digest goes out.
    const [{ time_zone: zone }] = await t.dataSource.query(`SELECT time_zone FROM site WHERE id = $1`, [ids.east]);
    const now = DateTime.now().setZone(zone).set({ hour: DIGEST_HOUR, minute: 0, second: 0, millisecond: 0 }).toJSDate();
    expect(await queueDailyDigests(t.dataSource, new Date(now.getTime() + 3 * 3600_000))).toBe(0);
    await t.dataSource.transaction((manager) =>
      openFollowUp(manager, {
        siteId: ids.east,
        kind: 'missed-sample',
        sourceEntity: 'missed-monitoring',
        sourceId: '00000000-0000-4000-8000-00000000d1e5',
        title: 'Missed sample: digest test at OF-002',
        dueAt: new Date(now.getTime() + 2 * 24 * 3600 * 1000),
      }),
    );
    await queueDailyDigests(t.dataSource, now);
    const digestOf = async (email: string) => {
      const [row] = await t.dataSource.query(
        `SELECT m.params FROM mail_outbox m JOIN app_user u ON u.id = m.user_id WHERE m.kind = 'digest' AND u.email = $1 AND m.event_key = $2`,
        [
          email,
          `digest:${(await t.dataSource.query(`SELECT id FROM app_user WHERE email = $1`, [email]))[0].id}:${DateTime.fromJSDate(now, { zone }).toISODate()}`,
        ],
      );
      return ((row?.params.lines ?? []) as string[]).join('\n');
    };
    const expected: Array<{ title: string }> = await t.dataSource.query(
      `SELECT title FROM follow_up WHERE site_id = $1 AND status = 'open' AND due_at <= $2::timestamptz + interval '7 days'`,
      [ids.east, now],
    );
    const east = await digestOf('coordinator.east@decant.test');
    for (const { title } of expected) expect(east).toContain(title);
    expect(east).toContain('Missed sample: digest test at OF-002');
    // The east-only coordinator hears nothing of the north site's violation; the one of both sites does.
    expect(east).not.toContain('OF-NT');
    expect(await digestOf('coordinator@decant.test')).toContain('OF-NT');
    // A second run the same day queues no second digest.
    expect(await queueDailyDigests(t.dataSource, now)).toBe(0);
  });

  it('turns a kind off from the link in a mail without signing in, and refuses a forged or expired link', async () => {
    const [operator] = await t.dataSource.query(`SELECT id FROM app_user WHERE email = 'operator@decant.test'`);
    const [boss] = await t.dataSource.query(`SELECT id FROM app_user WHERE email = 'coordinator@decant.test'`);
    const before = await t.dataSource.query(`SELECT count(*)::int AS n FROM mail_preference`);

    const forged = `${unsubscribeToken(operator.id, 'upkeep', 'not-the-secret').split('.')[0]}.${'A'.repeat(43)}`;
    const refused = await request(t.app).post('/api/mail/unsubscribe').type('form').send({ token: forged }).expect(400);
    expect(refused.text).toContain('Nothing was changed');
    const expired = unsubscribeToken(operator.id, 'upkeep', t.config.sessionSecret, new Date(Date.now() - 91 * 24 * 3600 * 1000));
    expect((await request(t.app).get(`/api/mail/unsubscribe?token=${expired}`).expect(400)).text).toContain('expired');
    expect((await t.dataSource.query(`SELECT count(*)::int AS n FROM mail_preference`))[0].n).toBe(before[0].n);

    const token = unsubscribeToken(operator.id, 'upkeep', t.config.sessionSecret);
    expect((await request(t.app).get(`/api/mail/unsubscribe?token=${token}`).expect(200)).text).toContain('Stop these mails');
    // RFC 8058 one-click: a POST with List-Unsubscribe=One-Click, the token in the link.
    await request(t.app).post(`/api/mail/unsubscribe?token=${token}`).type('form').send({ 'List-Unsubscribe': 'One-Click' }).expect(200);
    const operatorCookie = await t.sessionFor('operator@decant.test');
    const prefs = await request(t.app).get('/api/mail/preferences').set('cookie', operatorCookie).expect(200);
    expect(prefs.body.items.find((p: { kind: string }) => p.kind === 'upkeep').delivery).toBe('off');

    // A coordinator cannot turn violations off, by link or on screen.
    await request(t.app)
      .post(`/api/mail/unsubscribe?token=${unsubscribeToken(boss.id, 'violation', t.config.sessionSecret)}`)
      .expect(409);
    const put = await request(t.app)
      .put('/api/mail/preferences')
      .set('cookie', coordinator)
      .send({ items: [{ kind: 'violation', delivery: 'off' }] })
      .expect(400);
    expect(put.body.error.fields).toHaveProperty('items.0.delivery');
  });

  it('drafts the notice to the authority from the violation, sends it with its PDF, and closes the notice follow-up', async () => {
    const list = await request(t.app)
      .get(`/api/follow-ups?siteId=${ids.north}&status=open&pageSize=100`)
      .set('cookie', coordinator)
      .expect(200);
    const followUp = list.body.items.find(
      (f: { kind: string; title: string }) => f.kind === 'notify-control-authority' && f.title.includes('OF-NT'),
    );
    const draft = await request(t.app).get(`/api/follow-ups/${followUp.id}/notice`).set('cookie', coordinator).expect(200);
    expect(draft.body).toMatchObject({ status: 'new', to: null });
    expect(draft.body.facts).toMatchObject({
      permitNumber: 'NT-0001',
      pointCode: 'OF-NT',
      date: '2026-02-10',
      value: '31.0 mg/L',
      limit: 20,
      sampledAt: ['2026-02-10 09:30'],
    });
    const account = {
      cause: 'A coolant sump overflowed into the floor drain',
      correctiveAction: 'Drain sealed; sump level alarm fitted',
      repeatSampleOn: '2026-02-20',
    };

    // The permit has no address for the authority: the draft is kept, nothing is sent.
    const refused = await request(t.app)
      .post(`/api/follow-ups/${followUp.id}/notice/send`)
      .set('cookie', coordinator)
      .send(account)
      .expect(400);
    expect(refused.body.error.fields.to).toContain('has no address');
    await request(t.app).put(`/api/follow-ups/${followUp.id}/notice`).set('cookie', coordinator).send(account).expect(200);
    expect((await request(t.app).get(`/api/follow-ups/${followUp.id}/notice`).set('cookie', coordinator)).body).toMatchObject({
      status: 'draft',
      ...account,
    });
    const incomplete = await request(t.app)
      .post(`/api/follow-ups/${followUp.id}/notice/send`)
      .set('cookie', coordinator)
      .send({ cause: '' })
      .expect(400);
    expect(incomplete.body.error.fields).toHaveProperty('cause');

    await request(t.app)
      .patch(`/api/permits/${permitId}`)
      .set('cookie', coordinator)
      .send({ authorityEmail: 'pretreatment@basin-water.test' })
      .expect(200);
    const sent = await request(t.app)
      .post(`/api/follow-ups/${followUp.id}/notice/send`)
      .set('cookie', coordinator)
      .send(account)
      .expect(200);
    expect(sent.body).toMatchObject({ status: 'sent', to: 'pretreatment@basin-water.test', onTime: true });
    const [closed] = await t.dataSource.query(
      `SELECT status, closing_note, closing_file_id, closed_by_entity FROM follow_up WHERE id = $1`,
      [followUp.id],
    );
    expect(closed).toMatchObject({ status: 'done', closed_by_entity: 'authority-notice' });
    expect(closed.closing_note).toMatch(/^Notice sent to pretreatment@basin-water\.test on .+ \(site time\), on time$/);

    await deliverPendingMail(t.dataSource, mail);
    const [toAuthority] = (await inbox.messages()).filter((m) => m.to[0]!.address === 'pretreatment@basin-water.test');
    expect(toAuthority!.subject).toContain('Notice of a violation: Tamsin Creek Works, permit NT-0001');
    expect(toAuthority!.text).toContain('Cause: A coolant sump overflowed into the floor drain');
    expect(toAuthority!.text).not.toContain('unsubscribe');
    const attachment = (
      toAuthority as unknown as { attachments: Array<{ fileName?: string; generatedFileName?: string; contentType: string }> }
    ).attachments[0]!;
    expect(attachment.contentType).toBe('application/pdf');
    // The PDF is the follow-up's evidence file, so the period's evidence bundle carries it.
    const pdf = await request(t.app)
      .get(`/api/follow-ups/${followUp.id}/file`)
      .set('cookie', coordinator)
      .buffer(true)
      .parse(binary as never)
      .expect(200);
    const parser = new PDFParse({ data: new Uint8Array(pdf.body) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain('Notice of a permit limit violation');
    expect(text).toContain('NT-0001');
    expect(text).toContain('31.0 mg/L on 2026-02-10');
    expect(text).toContain('Drain sealed; sump level alarm fitted');

    // Sent is final: no new draft, and the database refuses a change made around the app.
    await request(t.app).put(`/api/follow-ups/${followUp.id}/notice`).set('cookie', coordinator).send(account).expect(409);
    await expect(
      t.dataSource.query(`UPDATE authority_notice SET cause = 'changed' WHERE follow_up_id = $1`, [followUp.id]),
    ).rejects.toThrow(/kept as sent/);
  });

  it('sends a reminder when a follow-up becomes overdue, and drops it if the follow-up closed before it went', async () => {
    const now = Date.now();
    const opened = async (sourceId: string) => {
      await t.dataSource.transaction((manager) =>
        openFollowUp(manager, {
          siteId: ids.north,
          kind: 'missed-sample',
          sourceEntity: 'missed-monitoring',
          sourceId,
          title: `Reminder test ${sourceId.slice(-4)}`,
          dueAt: new Date(now + 3600_000),
        }),
      );
      return (await t.dataSource.query(`SELECT id FROM follow_up WHERE source_id = $1`, [sourceId]))[0].id as string;
    };
    const kept = await opened('00000000-0000-4000-8000-00000000aa01');
    const closedFirst = await opened('00000000-0000-4000-8000-00000000aa02');
    // Two hours on, both are overdue: the sweep queues one reminder each per coordinator.
    await sweepDeadlines(t.dataSource, new Date(now + 2 * 3600_000));
    const queued = await t.dataSource.query(
      `SELECT follow_up_id, status FROM mail_outbox WHERE event_key LIKE 'reminder:%' AND follow_up_id = ANY($1::uuid[])`,
      [[kept, closedFirst]],
    );
    expect(queued.filter((row: { follow_up_id: string }) => row.follow_up_id === kept).length).toBeGreaterThan(0);
    await request(t.app)
      .post(`/api/follow-ups/${closedFirst}/close`)
      .set('cookie', coordinator)
      .send({ note: 'Sample taken after all' })
      .expect(200);
    await deliverPendingMail(t.dataSource, mail);
    const after: Array<{ follow_up_id: string; status: string }> = await t.dataSource.query(
      `SELECT follow_up_id, status FROM mail_outbox WHERE event_key LIKE 'reminder:%' AND follow_up_id = ANY($1::uuid[])`,
      [[kept, closedFirst]],
    );
    expect(new Set(after.filter((row) => row.follow_up_id === kept).map((row) => row.status))).toEqual(new Set(['sent']));
    expect(new Set(after.filter((row) => row.follow_up_id === closedFirst).map((row) => row.status))).toEqual(new Set(['dropped']));
    expect(await messagesAbout('Reminder test aa02')).toHaveLength(0);
    expect((await messagesAbout('Reminder test aa01')).length).toBeGreaterThan(0);
  });

  it('opens a signed-copy deadline from the calendar, without a compile, and mails it (40 CFR 262.42)', async () => {
    const shipped = new Date(Date.now() - 50 * 86_400_000).toISOString().slice(0, 10);
    const created = await request(t.app)
      .post('/api/shipments')
      .set('cookie', coordinator)
      .send({
        siteId: ids.north,
        shippedOn: shipped,
        documentKind: 'hazardous-waste-manifest',
        documentNumber: '100200300SWP',
        transporterName: 'Test Hauler',
        transporterEpaId: 'ILR000000001',
        receiverName: 'Test Recycler',
        receiverEpaId: 'ILD000000002',
        wasteDescription: 'Used oil',
        quantity: 220,
        quantityUnit: 'gal',
      })
      .expect(201);
    await sweepDeadlines(t.dataSource);
    const [followUp] = await t.dataSource.query(`SELECT id, kind FROM follow_up WHERE source_entity = 'shipment' AND source_id = $1`, [
      created.body.id,
    ]);
    expect(followUp.kind).toBe('contact-transporter-and-facility');
    const mails = await t.dataSource.query(`SELECT kind, recipient FROM mail_outbox WHERE event_key = $1`, [`opened:${followUp.id}`]);
    expect(mails.length).toBeGreaterThan(0);
    expect(mails.every((m: { kind: string }) => m.kind === 'shipment-copy')).toBe(true);
  });
});
