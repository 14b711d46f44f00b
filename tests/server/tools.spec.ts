import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

/** The tank check over HTTP: the person's units in, verdict and figures in words out, bad input named. */
describe('the tank check', () => {
  let t: TestApp;
  let coordinator: string;
  beforeAll(async () => {
    t = await startTestApp();
    coordinator = await t.sessionFor('coordinator@decant.test');
  });
  afterAll(() => t.close());

  const check = (body: object, cookie = coordinator) => request(t.app).post('/api/tools/tank-check').set('cookie', cookie).send(body);
  // 2 m × 1 m, 1.2 m deep, 7.2 m³/h (2 L/s), oil SG 0.85 at 20 °C: see tests/unit/tank-check.spec.ts.
  const metric = {
    unitSystem: 'metric',
    shape: 'rectangular',
    length: 2,
    width: 1,
    depth: 1.2,
    flow: 7.2,
    waterTemperature: 20,
    oilSpecificGravity: 0.85,
  };

  it('says whether the design droplet surfaces, with the margin, and says it is an estimate', async () => {
    const { body } = await check(metric).expect(200);
    expect(body.verdict).toBe('rises');
    expect(body.summary).toBe('Oil of 150 µm needs 11 min to surface; water stays 20 min — enough, with 1.8 times the time needed.');
    expect(body.stokesNote).toMatch(/^Stokes’ law applies/);
    expect(body.caution).toContain('does not replace a licensed engineer');
    const busy = await check({ ...metric, flow: 18 }).expect(200);
    expect(busy.body.verdict).toBe('too-short');
    expect(busy.body.remedies[0]).toBe('A smaller flow: at most 13.13 m³/h through this tank.');
  });

  it('gives the same verdict for the same tank in US units', async () => {
    // 2 m = 6.5617 ft, 1 m = 3.2808 ft, 1.2 m = 3.937 ft, 7.2 m³/h = 31.70 gal/min, 20 °C = 68 °F.
    const us = { ...metric, unitSystem: 'us', length: 6.5617, width: 3.2808, depth: 3.937, flow: 31.7006, waterTemperature: 68 };
    const { body } = await check(us).expect(200);
    expect(body.summary).toBe('Oil of 150 µm needs 11 min to surface; water stays 20 min — enough, with 1.8 times the time needed.');
    expect(body.figures.find((f: { label: string }) => f.label === 'Water surface').value).toBe('21.5 ft²');
  });

  it('names each field it cannot use, and stays closed to a role without the tools', async () => {
    const bad = await check({ ...metric, width: undefined, depth: 0, waterTemperature: 95, oilSpecificGravity: 1.02 }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['depth', 'oilSpecificGravity', 'waterTemperature', 'width']);
    expect(bad.body.error.fields.oilSpecificGravity).toContain('does not float');
    const usBad = await check({ ...metric, unitSystem: 'us', waterTemperature: 20 }).expect(400);
    expect(usBad.body.error.fields.waterTemperature).toBe('Use 32 to 176 °F');
    await check(metric, await t.sessionFor('admin@decant.test')).expect(403);
    await check(metric, await t.sessionFor('auditor@decant.test')).expect(403);
  });
});

/**
 * Skimmer fit by the 2× rule (common practice, no published source: rate a skimmer at least
 * twice the removal it must do), against the oil log of the last 90 days, per hour run.
 */
describe('skimmer fit', () => {
  let t: TestApp;
  let coordinator: string;
  let siteId: string;
  beforeAll(async () => {
    t = await startTestApp();
    coordinator = await t.sessionFor('coordinator@decant.test');
    [{ id: siteId }] = await t.dataSource.query(`SELECT id FROM site WHERE name = 'Tamsin Creek Works'`);
  });
  afterAll(() => t.close());

  const equipment = async (name: string, ratedCapacity: number) =>
    (
      await request(t.app)
        .post('/api/equipment')
        .set('cookie', coordinator)
        .send({ siteId, name, kind: 'tube-skimmer', ratedCapacity, ratedUnit: 'L/h', upkeepIntervalDays: 30 })
        .expect(201)
    ).body.id as string;
  const log = (equipmentId: string, daysAgo: number, litres: number, hoursRun: number) =>
    request(t.app)
      .post('/api/oil-log')
      .set('cookie', coordinator)
      .send({
        equipmentId,
        collectedOn: new Date(Date.now() - daysAgo * 86_400_000).toISOString().slice(0, 10),
        volume: litres,
        unit: 'L',
        hoursRun,
      })
      .expect(201);

  it('flags equipment rated below twice its peak removal, and names the rating it should have', async () => {
    // 1, 2 and 3 L over 8 h runs: typical 0.25 L/h, peak 0.375 L/h, so a rating of 0.75 L/h at least.
    const small = await equipment('Fit test, small tube', 0.7);
    const ample = await equipment('Fit test, ample tube', 0.8);
    for (const id of [small, ample])
      for (const [day, litres] of [
        [3, 1],
        [2, 2],
        [1, 3],
      ] as const)
        await log(id, day, litres, 8);
    const { body } = await request(t.app).get(`/api/tools/skimmer-fit?siteId=${siteId}`).set('cookie', coordinator).expect(200);
    const item = (id: string) => body.items.find((i: { equipmentId: string }) => i.equipmentId === id);
    expect(item(small)).toMatchObject({ daysLogged: 3, verdict: 'undersized' });
    expect(item(small).typicalLph).toBeCloseTo(0.25, 9);
    expect(item(small).peakLph).toBeCloseTo(0.375, 9);
    expect(item(small).recommendedLph).toBeCloseTo(0.75, 9);
    expect(item(ample).verdict).toBe('fits');
    expect(body.caution).toContain('Common practice, no published source');
    // The oil log's own rate flag uses the same rule on the same equipment.
    const listed = await request(t.app).get(`/api/equipment?siteId=${siteId}`).set('cookie', coordinator).expect(200);
    expect(listed.body.items.find((e: { id: string }) => e.id === ample).likelyUndersized).toBe(false);
  });
});
