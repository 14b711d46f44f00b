import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { certificateBody, demoIds } from '../fixtures/lab.js';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

type Ids = Awaited<ReturnType<typeof demoIds>>;
interface Case {
  name: string;
  method: 'post' | 'patch' | 'put';
  path: (ids: Ids) => string;
  body: (ids: Ids) => unknown;
  field: string;
}

const certificateWith = (ids: Ids, change: (body: ReturnType<typeof certificateBody>) => void) => {
  const body = certificateBody(ids);
  change(body);
  return body;
};
const validPermit = (ids: Ids) => ({
  siteId: ids.north,
  kind: 'pretreatment',
  number: 'X-1',
  issuingAuthority: 'Authority',
  effectiveFrom: '2026-01-01',
  reportingFrequency: 'quarterly',
  reportDueDays: 30,
  nonDetectPolicy: 'zero',
});
const validLimit = (ids: Ids) => ({
  dischargePointId: ids.northOutfall,
  parameterId: ids.hem,
  statistic: 'daily-maximum',
  value: 100,
  unit: 'mg/L',
  frequencyCount: 1,
  frequencyPer: 'month',
  sampleType: 'grab',
});

const cases: Case[] = [
  {
    name: 'site whose name holds a NUL character',
    method: 'post',
    path: () => '/api/sites',
    field: 'name',
    body: () => ({ name: 'Works\u0000', timeZone: 'America/Chicago', retentionYears: 5, generatorStatus: 'small' }),
  },
  {
    name: 'site whose address hides a right-to-left override',
    method: 'post',
    path: () => '/api/sites',
    field: 'address',
    body: () => ({
      name: 'Works',
      address: '12 Mill \u202Eevird',
      timeZone: 'America/Chicago',
      retentionYears: 5,
      generatorStatus: 'small',
    }),
  },
  {
    name: 'permit in force from year 0',
    method: 'post',
    path: () => '/api/permits',
    field: 'effectiveFrom',
    body: (ids) => ({ ...validPermit(ids), effectiveFrom: '0000-01-01' }),
  },
  {
    name: 'limit of 1e308',
    method: 'post',
    path: (ids) => `/api/permits/${ids.northPermit}/limits`,
    field: 'value',
    body: (ids) => ({ ...validLimit(ids), value: 1e308 }),
  },
  {
    name: 'result with a 30-digit value',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples.0.results.0.value',
    body: (ids) => certificateWith(ids, (b) => (b.samples[0]!.results[0]!.value = '123456789012345678901234567890')),
  },
  {
    name: 'site with a retention below 3 years',
    method: 'post',
    path: () => '/api/sites',
    field: 'retentionYears',
    body: () => ({ name: 'New site', timeZone: 'America/Chicago', retentionYears: 2, generatorStatus: 'small' }),
  },
  {
    name: 'site with an unknown time zone',
    method: 'post',
    path: () => '/api/sites',
    field: 'timeZone',
    body: () => ({ name: 'New site', timeZone: 'Mars/Olympus', retentionYears: 5, generatorStatus: 'small' }),
  },
  {
    name: 'site with an unknown generator status',
    method: 'post',
    path: () => '/api/sites',
    field: 'generatorStatus',
    body: () => ({ name: 'New site', timeZone: 'America/Chicago', retentionYears: 5, generatorStatus: 'huge' }),
  },
  {
    name: 'discharge point with spaces in its code',
    method: 'post',
    path: (ids) => `/api/sites/${ids.north}/discharge-points`,
    field: 'code',
    body: () => ({ code: 'OF 9', name: 'Nine', receiving: 'sewer' }),
  },
  {
    name: 'discharge point with an unknown receiving water',
    method: 'post',
    path: (ids) => `/api/sites/${ids.north}/discharge-points`,
    field: 'receiving',
    body: () => ({ code: 'OF-9', name: 'Nine', receiving: 'ocean' }),
  },
  {
    name: 'parameter with an unknown unit',
    method: 'post',
    path: () => '/api/parameters',
    field: 'defaultUnit',
    body: (ids) => ({ siteId: ids.north, code: 'zinc', name: 'Zinc', defaultUnit: 'furlongs' }),
  },
  {
    name: 'permit of an unknown kind',
    method: 'post',
    path: () => '/api/permits',
    field: 'kind',
    body: (ids) => ({ ...validPermit(ids), kind: 'private' }),
  },
  {
    name: 'permit ending before it starts',
    method: 'post',
    path: () => '/api/permits',
    field: 'effectiveTo',
    body: (ids) => ({ ...validPermit(ids), effectiveTo: '2025-12-31' }),
  },
  {
    name: 'permit with a mass-loading factor other than 8.34 or 8.3454',
    method: 'post',
    path: () => '/api/permits',
    field: 'massLoadingFactor',
    body: (ids) => ({ ...validPermit(ids), massLoadingFactor: 8.5 }),
  },
  {
    name: 'permit with an unknown non-detect policy',
    method: 'post',
    path: () => '/api/permits',
    field: 'nonDetectPolicy',
    body: (ids) => ({ ...validPermit(ids), nonDetectPolicy: 'ignore' }),
  },
  {
    name: 'limit with a negative value',
    method: 'post',
    path: (ids) => `/api/permits/${ids.northPermit}/limits`,
    field: 'value',
    body: (ids) => ({ ...validLimit(ids), value: -1 }),
  },
  {
    name: 'limit with an unknown statistic',
    method: 'post',
    path: (ids) => `/api/permits/${ids.northPermit}/limits`,
    field: 'statistic',
    body: (ids) => ({ ...validLimit(ids), statistic: 'weekly-median' }),
  },
  {
    name: 'limit in a unit that does not fit the parameter',
    method: 'post',
    path: (ids) => `/api/permits/${ids.northPermit}/limits`,
    field: 'unit',
    body: (ids) => ({ ...validLimit(ids), statistic: 'instantaneous-maximum', unit: 'SU' }),
  },
  {
    name: 'limit reported to 7 decimal places',
    method: 'post',
    path: (ids) => `/api/permits/${ids.northPermit}/limits`,
    field: 'reportedDecimals',
    body: (ids) => ({ ...validLimit(ids), statistic: 'instantaneous-maximum', reportedDecimals: 7 }),
  },
  {
    name: 'loading limit (lb/day) as an instantaneous maximum',
    method: 'post',
    path: (ids) => `/api/permits/${ids.northPermit}/limits`,
    field: 'statistic',
    body: (ids) => ({ ...validLimit(ids), statistic: 'instantaneous-maximum', unit: 'lb/day' }),
  },
  {
    name: 'limit at another site’s point',
    method: 'post',
    path: (ids) => `/api/permits/${ids.northPermit}/limits`,
    field: 'dischargePointId',
    body: (ids) => ({ ...validLimit(ids), statistic: 'instantaneous-maximum', dischargePointId: ids.eastOutfall }),
  },
  {
    name: 'certificate without samples',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples',
    body: (ids) => certificateWith(ids, (b) => (b.samples = [])),
  },
  {
    name: 'certificate received on a non-date',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'receivedOn',
    body: (ids) => certificateWith(ids, (b) => (b.receivedOn = '03/03/2026')),
  },
  {
    name: 'sample collected at a malformed time',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples.0.collectedAt',
    body: (ids) => certificateWith(ids, (b) => (b.samples[0]!.collectedAt = 'yesterday')),
  },
  {
    name: 'sample of an unknown type',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples.0.sampleType',
    body: (ids) => certificateWith(ids, (b) => ((b.samples[0] as { sampleType: string }).sampleType = 'bucket')),
  },
  {
    name: 'result with a value that is not a number',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples.0.results.0.value',
    body: (ids) => certificateWith(ids, (b) => (b.samples[0]!.results[0]!.value = 'twelve')),
  },
  {
    name: 'result with an unknown unit',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples.0.results.0.unit',
    body: (ids) => certificateWith(ids, (b) => (b.samples[0]!.results[0]!.unit = 'mg/dL')),
  },
  {
    name: 'result with a qualifier other than "<"',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples.0.results.0.qualifier',
    body: (ids) => certificateWith(ids, (b) => ((b.samples[0]!.results[0] as { qualifier: unknown }).qualifier = '>')),
  },
  {
    name: 'result at another site’s point',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples.0.dischargePointId',
    body: (ids) => certificateWith(ids, (b) => (b.samples[0]!.dischargePointId = ids.eastOutfall)),
  },
  {
    name: 'result naming a QC batch the certificate lacks',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'samples.0.results.0.qcBatchCode',
    body: (ids) => certificateWith(ids, (b) => (b.samples[0]!.results[0]!.qcBatchCode = 'NOPE')),
  },
  {
    name: 'QC batch with a recovery that is not a number',
    method: 'post',
    path: () => '/api/lab-certificates',
    field: 'qcBatches.0.oprRecoveryPct',
    body: (ids) => certificateWith(ids, (b) => ((b.qcBatches[0] as { oprRecoveryPct: unknown }).oprRecoveryPct = 'high')),
  },
];

describe('malformed payloads are answered 400 naming the field, and write nothing', () => {
  let t: TestApp;
  let ids: Ids;
  let coordinator: string;
  const tables = [
    'site',
    'discharge_point',
    'parameter',
    'permit',
    'permit_limit',
    'lab_certificate',
    'lab_sample',
    'lab_result',
    'qc_batch',
    'trail_entry',
  ];
  const counts = async () => Object.fromEntries(await Promise.all(tables.map(async (table) => [table, await t.count(table)])));

  beforeAll(async () => {
    t = await startTestApp();
    ids = await demoIds(t.dataSource);
    coordinator = await t.sessionFor('coordinator@decant.test');
  });
  afterAll(() => t.close());

  it('has at least 20 cases', () => expect(cases.length).toBeGreaterThanOrEqual(20));

  // A sort key is looked up among the list's own keys: `constructor` used to reach Object.prototype.
  for (const list of [
    '/api/users',
    '/api/shipments',
    '/api/lab-certificates',
    '/api/lab-certificates/results',
    '/api/oil-log',
    '/api/trail',
  ]) {
    it(`refuses sortBy=constructor on ${list}`, async () => {
      const admin = await t.sessionFor('admin@decant.test');
      const response = await request(t.app)
        .get(`${list}?sortBy=constructor`)
        .set('cookie', list === '/api/users' ? admin : coordinator);
      expect(response.status).toBe(400);
      expect(response.body.error.fields).toHaveProperty(['query.sortBy']);
    });
  }

  it('refuses a NUL character in a query string, naming it', async () => {
    const response = await request(t.app).get('/api/lab-certificates?search=a%00b').set('cookie', coordinator);
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toHaveProperty(['query.search']);
  });

  for (const testCase of cases) {
    it(`refuses a ${testCase.name}`, async () => {
      const before = await counts();
      const response = await request(t.app)
        [testCase.method](testCase.path(ids))
        .set('cookie', coordinator)
        .send(testCase.body(ids as Ids) as object);
      expect(response.status).toBe(400);
      expect(response.body.error.code).toBe('invalid_input');
      expect(response.body.error.fields).toHaveProperty([testCase.field]);
      expect(await counts()).toEqual(before);
    });
  }
});
