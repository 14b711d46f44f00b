import { DateTime } from 'luxon';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { upkeepChecklists } from '../../server/contracts/upkeep-checklists.js';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

const today = () => DateTime.now().setZone('America/Chicago').toISODate()!;
const daysAgo = (days: number) => DateTime.now().setZone('America/Chicago').minus({ days }).toISODate()!;

describe('oil log, upkeep and shipments', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  let operator: string;
  let coordinator: string;
  let belt: { id: string; ratedLitresPerHour: number };
  const shipment = (overrides: Record<string, unknown> = {}) => ({
    siteId: ids.north,
    shippedOn: daysAgo(61),
    documentKind: 'hazardous-waste-manifest',
    documentNumber: `${100000000 + Math.floor(Math.random() * 899999999)}ABC`,
    transporterName: 'Test Hauler',
    transporterEpaId: 'ILR000000001',
    receiverName: 'Test Recycler',
    receiverEpaId: 'ILD000000002',
    wasteDescription: 'Used oil',
    quantity: 220,
    quantityUnit: 'gal',
    ...overrides,
  });

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    operator = await t.sessionFor('operator@decant.test');
    coordinator = await t.sessionFor('coordinator@decant.test');
    const list = await request(t.app).get(`/api/equipment?siteId=${ids.north}`).set('cookie', operator).expect(200);
    belt = list.body.items.find((e: { kind: string }) => e.kind === 'belt-skimmer');
  });
  afterAll(() => t.close());

  describe('oil log', () => {
    it('stores litres whatever unit was entered, and lets the operator correct their own entry', async () => {
      const created = await request(t.app)
        .post('/api/oil-log')
        .set('cookie', operator)
        .send({ equipmentId: belt.id, collectedOn: today(), volume: 2, unit: 'gal', hoursRun: 8 })
        .expect(201);
      expect(created.body.volumeLitres).toBeCloseTo(7.570823568, 6);
      const fixed = await request(t.app).patch(`/api/oil-log/${created.body.id}`).set('cookie', operator).send({ volume: 3 }).expect(200);
      expect(fixed.body.volumeLitres).toBeCloseTo(11.356235352, 6);
      const trail = await t.dataSource.query(`SELECT action FROM trail_entry WHERE entity_id = $1 ORDER BY id`, [created.body.id]);
      expect(trail.map((e: { action: string }) => e.action)).toEqual(['create', 'update']);
    });

    it('refuses a future date, a volume no equipment could collect in a day, and unknown equipment, writing nothing', async () => {
      const before = await t.count('oil_log_entry');
      const future = DateTime.now().setZone('America/Chicago').plus({ days: 2 }).toISODate();
      const cases: Array<[Record<string, unknown>, string]> = [
        [{ equipmentId: belt.id, collectedOn: future, volume: 1, unit: 'gal' }, 'collectedOn'],
        [{ equipmentId: belt.id, collectedOn: today(), volume: belt.ratedLitresPerHour * 24 + 1, unit: 'L' }, 'volume'],
        [{ equipmentId: belt.id, collectedOn: today(), volume: -1, unit: 'L' }, 'volume'],
        [{ equipmentId: '00000000-0000-4000-8000-000000000000', collectedOn: today(), volume: 1, unit: 'L' }, 'equipmentId'],
        [{ equipmentId: belt.id, collectedOn: today(), volume: 1, unit: 'L', hoursRun: 25 }, 'hoursRun'],
      ];
      for (const [body, field] of cases) {
        const response = await request(t.app).post('/api/oil-log').set('cookie', operator).send(body).expect(400);
        expect(response.body.error.fields).toHaveProperty(field);
      }
      expect(await t.count('oil_log_entry')).toBe(before);
    });

    it('flags a collection faster than the rating over the hours run', async () => {
      const created = await request(t.app)
        .post('/api/oil-log')
        .set('cookie', operator)
        .send({ equipmentId: belt.id, collectedOn: today(), volume: belt.ratedLitresPerHour * 2 + 1, unit: 'L', hoursRun: 2 })
        .expect(201);
      expect(created.body.flags.map((f: { code: string }) => f.code)).toEqual(['above-rating']);
    });

    it("keeps an operator's older entries and other people's entries for the coordinator, who must give a reason", async () => {
      const [old] = await t.dataSource.query(
        `SELECT id FROM oil_log_entry WHERE site_id = $1 AND equipment_id = $2 ORDER BY collected_on LIMIT 1`,
        [ids.north, belt.id],
      );
      await t.dataSource.query(`UPDATE oil_log_entry SET created_at = now() - interval '3 days' WHERE id = $1`, [old.id]);
      await request(t.app).patch(`/api/oil-log/${old.id}`).set('cookie', operator).send({ volume: 1 }).expect(403);
      const refused = await request(t.app).patch(`/api/oil-log/${old.id}`).set('cookie', coordinator).send({ volume: 1 }).expect(400);
      expect(refused.body.error.fields).toHaveProperty('reason');
      await request(t.app)
        .patch(`/api/oil-log/${old.id}`)
        .set('cookie', coordinator)
        .send({ volume: 1, unit: 'gal', reason: 'Drum gauge misread' })
        .expect(200);
      const [entry] = await t.dataSource.query(
        `SELECT after FROM trail_entry WHERE entity_id = $1 AND action = 'update' ORDER BY id DESC LIMIT 1`,
        [old.id],
      );
      expect(entry.after.reason).toBe('Drum gauge misread');
    });

    it('totals litres per month for the site', async () => {
      const totals = await request(t.app).get(`/api/oil-log/totals?siteId=${ids.north}&by=month`).set('cookie', operator).expect(200);
      expect(totals.body.items.length).toBeGreaterThanOrEqual(17);
      expect(totals.body.items.every((row: { litres: number }) => row.litres > 0)).toBe(true);
    });
  });

  describe('upkeep checks', () => {
    it('opens one follow-up for a failed item', async () => {
      const items = upkeepChecklists['belt-skimmer'].map((item) => ({
        key: item.key,
        outcome: item.key === 'no-leaks' ? 'fail' : 'pass',
        note: '',
      }));
      const created = await request(t.app)
        .post('/api/upkeep-checks')
        .set('cookie', operator)
        .send({ equipmentId: belt.id, checkedOn: today(), items, immersionValue: 3, immersionUnit: 'in' })
        .expect(201);
      const followUps = await t.dataSource.query(`SELECT title, status FROM follow_up WHERE source_id = $1`, [created.body.id]);
      expect(followUps).toHaveLength(1);
      expect(followUps[0].title).toMatch(/no leaks/i);
    });
    it('refuses a checklist with an item missing', async () => {
      const response = await request(t.app)
        .post('/api/upkeep-checks')
        .set('cookie', operator)
        .send({ equipmentId: belt.id, checkedOn: today(), items: [{ key: 'no-leaks', outcome: 'pass' }] })
        .expect(400);
      expect(response.body.error.fields.items).toBe('Answer “Wipers or scrapers touch the medium evenly”: pass, fail or not applicable');
    });
    it("gives a separator a separator's checklist, and refuses a skimmer's items for it (common practice, no published source)", async () => {
      const list = await request(t.app).get(`/api/equipment?siteId=${ids.north}`).set('cookie', operator).expect(200);
      const separator = list.body.items.find((e: { kind: string }) => e.kind === 'oil-water-separator');
      const checks = await request(t.app).get(`/api/upkeep-checks?equipmentId=${separator.id}`).set('cookie', operator).expect(200);
      expect(checks.body.checklist.map((item: { key: string }) => item.key)).toEqual(
        upkeepChecklists['oil-water-separator'].map((item) => item.key),
      );
      expect(checks.body.checklist.map((item: { key: string }) => item.key)).not.toContain('wipers-even');
      const skimmerItems = upkeepChecklists['belt-skimmer'].map((item) => ({ key: item.key, outcome: 'pass' }));
      const refused = await request(t.app)
        .post('/api/upkeep-checks')
        .set('cookie', operator)
        .send({ equipmentId: separator.id, checkedOn: today(), items: skimmerItems })
        .expect(400);
      expect(refused.body.error.fields.items).toBe('“wipers-even” is not on the checklist of this kind of equipment');
    });
  });

  describe('shipments', () => {
    it('shows a large quantity generator the exception report overdue at 61 days without the signed copy (40 CFR 262.42(a)(2))', async () => {
      const created = await request(t.app).post('/api/shipments').set('cookie', coordinator).send(shipment()).expect(201);
      expect(created.body.status).toBe('overdue');
      expect(created.body.deadlines.map((d: { step: string; daysLeft: number }) => [d.step, d.daysLeft])).toEqual([
        ['contact-transporter-and-facility', -16],
        ['exception-report', -1],
      ]);
      const overdue = await request(t.app).get(`/api/shipments?siteId=${ids.north}&status=overdue`).set('cookie', coordinator).expect(200);
      expect(overdue.body.items.some((s: { id: string }) => s.id === created.body.id)).toBe(true);
    });

    it('gives a used-oil bill of lading no signed-copy deadline: 40 CFR 262.42 follows the hazardous waste manifest only', async () => {
      const created = await request(t.app)
        .post('/api/shipments')
        .set('cookie', coordinator)
        .send(shipment({ documentKind: 'used-oil-bill-of-lading', documentNumber: `UOB-TEST-${Date.now()}` }))
        .expect(201);
      expect(created.body).toMatchObject({ status: 'not-tracked', deadlines: [] });
      const overdue = await request(t.app).get(`/api/shipments?siteId=${ids.north}&status=overdue`).set('cookie', coordinator).expect(200);
      expect(overdue.body.items.some((s: { id: string }) => s.id === created.body.id)).toBe(false);
    });

    it('shows a demo that is recognisably invented: both kinds of papers, and identification numbers under no state code', async () => {
      const rows = await t.dataSource.query(
        `SELECT document_kind, count(*)::int AS n, bool_and(transporter_epa_id LIKE 'ZZ%' AND receiver_epa_id LIKE 'ZZ%') AS invented,
                bool_and(document_kind <> 'hazardous-waste-manifest' OR document_number LIKE '%QZD') AS invented_suffix
           FROM shipment WHERE transporter_name = 'Kestrel Fluid Haulers' GROUP BY document_kind`,
      );
      const kinds = Object.fromEntries(rows.map((row: { document_kind: string }) => [row.document_kind, row]));
      expect(kinds['used-oil-bill-of-lading'].n).toBeGreaterThan(kinds['hazardous-waste-manifest'].n);
      expect(rows.every((row: { invented: boolean; invented_suffix: boolean }) => row.invented && row.invented_suffix)).toBe(true);
    });

    it('flags used oil above 1,000 ppm total halogens (40 CFR 279.10(b)(1)(ii))', async () => {
      const created = await request(t.app)
        .post('/api/shipments')
        .set('cookie', operator)
        .send(shipment({ shippedOn: daysAgo(2), totalHalogensPpm: 1001 }))
        .expect(201);
      expect(created.body.flags.map((f: { code: string }) => f.code)).toEqual(['halogens-presumption']);
    });

    it('asks why papers entered more than 24 hours ago are corrected, and keeps the reason in the trail', async () => {
      const created = await request(t.app)
        .post('/api/shipments')
        .set('cookie', coordinator)
        .send(shipment({ shippedOn: daysAgo(3) }))
        .expect(201);
      await t.dataSource.query(`UPDATE shipment SET created_at = now() - interval '25 hours' WHERE id = $1`, [created.body.id]);
      const refused = await request(t.app)
        .patch(`/api/shipments/${created.body.id}`)
        .set('cookie', coordinator)
        .send({ quantity: 50 })
        .expect(400);
      expect(refused.body.error.fields).toHaveProperty('reason');
      // Recording the signed copy's return is a step of the papers, not a correction.
      await request(t.app)
        .patch(`/api/shipments/${created.body.id}`)
        .set('cookie', coordinator)
        .send({ signedCopyReceivedOn: daysAgo(1) })
        .expect(200);
      await request(t.app)
        .patch(`/api/shipments/${created.body.id}`)
        .set('cookie', coordinator)
        .send({ quantity: 50, reason: 'Weight ticket reread' })
        .expect(200);
      const [entry] = await t.dataSource.query(
        `SELECT after FROM trail_entry WHERE entity = 'shipment' AND entity_id = $1 ORDER BY chain_seq DESC LIMIT 1`,
        [created.body.id],
      );
      expect(entry.after.reason).toBe('Weight ticket reread');
    });

    it('refuses malformed papers and writes nothing', async () => {
      const before = await t.count('shipment');
      const cases: Array<[Record<string, unknown>, string]> = [
        [shipment({ documentNumber: '12345678ABC' }), 'documentNumber'],
        [shipment({ transporterEpaId: 'IL12' }), 'transporterEpaId'],
        [shipment({ receiverEpaId: '12D000000002' }), 'receiverEpaId'],
        [shipment({ shippedOn: daysAgo(5), signedCopyReceivedOn: daysAgo(6) }), 'signedCopyReceivedOn'],
        [shipment({ quantity: 0 }), 'quantity'],
      ];
      for (const [body, field] of cases) {
        const response = await request(t.app).post('/api/shipments').set('cookie', coordinator).send(body).expect(400);
        expect(response.body.error.fields).toHaveProperty(field);
      }
      expect(await t.count('shipment')).toBe(before);
    });

    it('lets the operator record papers but not change them once the signed copy is in; the coordinator still can', async () => {
      const created = await request(t.app)
        .post('/api/shipments')
        .set('cookie', operator)
        .send(shipment({ shippedOn: daysAgo(20) }))
        .expect(201);
      await request(t.app)
        .patch(`/api/shipments/${created.body.id}`)
        .set('cookie', operator)
        .send({ signedCopyReceivedOn: daysAgo(3) })
        .expect(200);
      await request(t.app).patch(`/api/shipments/${created.body.id}`).set('cookie', operator).send({ quantity: 230 }).expect(403);
      const fixed = await request(t.app)
        .patch(`/api/shipments/${created.body.id}`)
        .set('cookie', coordinator)
        .send({ quantity: 230 })
        .expect(200);
      expect({ status: fixed.body.status, quantity: fixed.body.quantity, deadlines: fixed.body.deadlines }).toEqual({
        status: 'complete',
        quantity: 230,
        deadlines: [],
      });
    });

    it('lets the auditor read only, and keeps coordinator.east to their site', async () => {
      const auditor = await t.sessionFor('auditor@decant.test');
      await request(t.app).get(`/api/shipments?siteId=${ids.north}`).set('cookie', auditor).expect(200);
      await request(t.app).post('/api/shipments').set('cookie', auditor).send(shipment()).expect(403);
      await request(t.app).post('/api/oil-log').set('cookie', auditor).send({}).expect(403);
      const east = await t.sessionFor('coordinator.east@decant.test');
      await request(t.app).get(`/api/shipments?siteId=${ids.north}`).set('cookie', east).expect(403);
      await request(t.app).get(`/api/equipment/${belt.id}`).set('cookie', east).expect(404);
      const mine = await request(t.app).get('/api/shipments?pageSize=200').set('cookie', east).expect(200);
      expect(mine.body.items.every((s: { siteId: string }) => s.siteId === ids.east)).toBe(true);
    });
  });

  describe('oil on hand', () => {
    it('takes an opening balance from the coordinator only, and counts from the day after it', async () => {
      const operatorCookie = operator;
      await request(t.app)
        .put(`/api/sites/${ids.east}/oil-on-hand/opening-balance`)
        .set('cookie', operatorCookie)
        .send({ volume: 10, unit: 'gal', on: today() })
        .expect(403);
      await request(t.app)
        .put(`/api/sites/${ids.east}/oil-on-hand/opening-balance`)
        .set('cookie', coordinator)
        .send({ volume: 10, unit: 'gal', on: today() })
        .expect(204);
      const balance = await request(t.app).get(`/api/sites/${ids.east}/oil-on-hand`).set('cookie', coordinator).expect(200);
      // 10 US gal = 37.854 L, kept to the hundredth of a litre.
      expect(balance.body.openingLitres).toBeCloseTo(37.85, 2);
      expect(balance.body.collectedLitres).toBe(0);
      const refused = await request(t.app)
        .put(`/api/sites/${ids.east}/oil-on-hand/opening-balance`)
        .set('cookie', coordinator)
        .send({ volume: -5, unit: 'gal', on: today() })
        .expect(400);
      expect(refused.body.error.fields).toHaveProperty('volume');
    });

    it('is opening balance plus collected minus shipped, with the 112.1 caution above 1,320 gal of storage', async () => {
      const response = await request(t.app).get(`/api/sites/${ids.north}/oil-on-hand`).set('cookie', operator).expect(200);
      const { openingLitres, collectedLitres, shippedLitres, onHandLitres, flags } = response.body;
      expect(onHandLitres).toBeCloseTo(openingLitres + collectedLitres - shippedLitres, 6);
      // The demo's north site stores 1,650 gal.
      expect(flags.map((f: { code: string }) => f.code)).toContain('spcc-threshold');
    });
  });
});

describe('photos and scans get the same file checks as certificates', () => {
  let t: TestApp;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
  });
  afterAll(() => t.close());

  it('refuses a text file as a shipment scan and a PDF as an upkeep photo, storing nothing', async () => {
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const [shipment] = await t.dataSource.query('SELECT id FROM shipment WHERE site_id = $1 LIMIT 1', [ids.north]);
    const before = await t.count('stored_file');
    const scan = await request(t.app)
      .post(`/api/shipments/${shipment.id}/files`)
      .set('cookie', coordinator)
      .attach('file', Buffer.from('not a scan at all'), 'manifest.pdf')
      .expect(415);
    expect(scan.body.error.fields).toHaveProperty('file');
    const photo = await request(t.app)
      .post('/api/upkeep-checks/photos')
      .set('cookie', coordinator)
      .field('siteId', ids.north)
      .attach('file', Buffer.from('%PDF-1.4\n%%EOF\n'), 'wiper.jpg')
      .expect(415);
    expect(photo.body.error.fields).toHaveProperty('file');
    await request(t.app)
      .post('/api/upkeep-checks/photos')
      .set('cookie', coordinator)
      .field('siteId', ids.north)
      .attach('file', Buffer.from('%PDF-1.4\n%%EOF\n'), '../../wiper.jpg')
      .expect((res) => expect([400, 415]).toContain(res.status));
    expect(await t.count('stored_file')).toBe(before);
  });

  it('stores a real PNG photo and a PDF scan with their SHA-256', async () => {
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const png = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c489', 'hex');
    const photo = await request(t.app)
      .post('/api/upkeep-checks/photos')
      .set('cookie', coordinator)
      .field('siteId', ids.north)
      .attach('file', png, 'wiper.png')
      .expect(201);
    expect(photo.body.sha256).toMatch(/^[0-9a-f]{64}$/);
    const [shipment] = await t.dataSource.query('SELECT id FROM shipment WHERE site_id = $1 AND signed_copy_received_on IS NULL LIMIT 1', [
      ids.north,
    ]);
    const scanned = await request(t.app)
      .post(`/api/shipments/${shipment.id}/files`)
      .set('cookie', coordinator)
      .attach('file', Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n'), 'manifest.pdf')
      .expect(201);
    expect(scanned.body.files.length).toBeGreaterThan(0);
  });

  const png = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c489', 'hex');
  const uploadPhoto = (cookie: string, site: string, name: string) =>
    request(t.app).post('/api/upkeep-checks/photos').set('cookie', cookie).field('siteId', site).attach('file', png, name);
  const upkeepAt = async (cookie: string, site: string, photoFileId: string) => {
    const [equipment] = await t.dataSource.query('SELECT id FROM equipment WHERE site_id = $1 AND active ORDER BY name LIMIT 1', [site]);
    const { body: listing } = await request(t.app).get(`/api/upkeep-checks?equipmentId=${equipment.id}`).set('cookie', cookie).expect(200);
    const items = listing.checklist.map((item: { key: string }, index: number) => ({
      key: item.key,
      outcome: 'pass',
      photoFileId: index === 0 ? photoFileId : null,
    }));
    return request(t.app)
      .post('/api/upkeep-checks')
      .set('cookie', cookie)
      .send({ equipmentId: equipment.id, checkedOn: '2026-01-05', items });
  };

  it("will not let another site's file be named as a photo, nor read through one", async () => {
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const [certificate] = await t.dataSource.query(
      'SELECT file_id FROM lab_certificate WHERE site_id = $1 AND file_id IS NOT NULL LIMIT 1',
      [ids.east],
    );
    const before = await t.count('upkeep_check');
    const refused = await upkeepAt(coordinator, ids.north, certificate.file_id);
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toHaveProperty('items');
    expect(await t.count('upkeep_check')).toBe(before);
    await request(t.app).get(`/api/upkeep-checks/photos/${certificate.file_id}`).set('cookie', coordinator).expect(404);
  });

  it('gives a photo to one check of its own site, once, and shows it to others only then', async () => {
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const auditor = await t.sessionFor('auditor@decant.test');
    const photo = await uploadPhoto(coordinator, ids.north, 'Prüfbericht.png').expect(201);
    expect(photo.body.fileName).toBe('Prüfbericht.png');
    await request(t.app).get(`/api/upkeep-checks/photos/${photo.body.id}`).set('cookie', auditor).expect(404);
    expect((await upkeepAt(coordinator, ids.east, photo.body.id)).status).toBe(400);
    expect((await upkeepAt(coordinator, ids.north, photo.body.id)).status).toBe(201);
    expect((await upkeepAt(coordinator, ids.north, photo.body.id)).status).toBe(400);
    await request(t.app).get(`/api/upkeep-checks/photos/${photo.body.id}`).set('cookie', auditor).expect(200);
    const [trail] = await t.dataSource.query(`SELECT action FROM trail_entry WHERE entity = 'upkeep-photo' AND entity_id = $1`, [
      photo.body.id,
    ]);
    expect(trail).toEqual({ action: 'upload' });
  });

  it('refuses a file name hiding a direction override', async () => {
    const coordinator = await t.sessionFor('coordinator@decant.test');
    const response = await uploadPhoto(coordinator, ids.north, 'wiper\u202Egnp.exe').expect(400);
    expect(response.body.error.fields).toHaveProperty('file');
  });

  it('refuses a photo upload for a site the person may not touch', async () => {
    const east = await t.sessionFor('coordinator.east@decant.test');
    await uploadPhoto(east, ids.north, 'x.png').expect(403);
  });
});
