// `npx tsx --tsconfig server/tsconfig.json tests/probe/hostile-input.probe.ts` (database up, as for
// the server tests): every JSON write route of the OpenAPI document gets malformed bodies, every
// upload route hostile files, as the coordinator; prints how many were tried, how many answered
// 5xx (the target is none), and the trail's verification on the demo database afterwards.
import request from 'supertest';
import { demoIds } from '../fixtures/lab.js';
import { startTestApp } from '../helpers/test-app.js';

const t = await startTestApp();
const ids = await demoIds(t.dataSource);
const cookie = await t.sessionFor('coordinator@decant.test');
const document = (await request(t.app).get('/api/openapi.json').set('cookie', cookie)).body as {
  paths: Record<
    string,
    Record<string, { requestBody?: { content?: Record<string, { schema?: { properties?: Record<string, unknown> } }> } }>
  >;
};

const fill = (path: string) =>
  path
    .replace('{siteId}', ids.north)
    .replace(/\{(id|limitId|fileId|revision)\}/g, (_m, name: string) =>
      name === 'revision' ? '1' : '00000000-0000-4000-8000-000000000000',
    );

const hostileValues: unknown[] = [
  '\u0000',
  '0000-01-01',
  1e308,
  -1e308,
  'x'.repeat(100_000),
  { nested: { deeper: [1, 2] } },
  [],
  true,
  null,
  '\u202e',
  NaN,
];
const failures: string[] = [];
let tried = 0;
for (const [path, methods] of Object.entries(document.paths)) {
  for (const [method, operation] of Object.entries(methods)) {
    if (!['post', 'put', 'patch'].includes(method)) continue;
    const schema = operation.requestBody?.content?.['application/json']?.schema;
    if (!schema) continue;
    const fields = Object.keys(schema.properties ?? {});
    const bodies: unknown[] = [
      {},
      [],
      'text',
      42,
      null,
      ...hostileValues.map((value) => Object.fromEntries(fields.map((field) => [field, value]))),
    ];
    for (const field of fields) for (const value of hostileValues) bodies.push({ [field]: value });
    for (const body of bodies) {
      tried += 1;
      const response = await request(t.app)
        [method as 'post'](`/api${fill(path)}`)
        .set('cookie', cookie)
        .set('content-type', 'application/json')
        .send(JSON.stringify(body));
      if (response.status >= 500)
        failures.push(`${method.toUpperCase()} ${path} ${JSON.stringify(body).slice(0, 80)} → ${response.status}`);
    }
  }
}
const malformed = { tried, fiveXX: failures.length };

// Hostile files at every upload route.
const [certificate] = await t.dataSource.query(`SELECT id FROM lab_certificate WHERE site_id = $1 LIMIT 1`, [ids.north]);
const [shipment] = await t.dataSource.query(`SELECT id FROM shipment WHERE site_id = $1 LIMIT 1`, [ids.north]);
const uploads: Array<{ path: string; fields: Record<string, string> }> = [
  { path: `/api/lab-certificates/${certificate.id}/file`, fields: {} },
  { path: `/api/shipments/${shipment.id}/scans`, fields: {} },
  { path: '/api/upkeep-checks/photos', fields: { siteId: ids.north } },
  { path: '/api/lab-certificates/import', fields: { siteId: ids.north } },
];
const files: Array<[string, Buffer]> = [
  ['empty.pdf', Buffer.alloc(0)],
  ['text.pdf', Buffer.from('not a pdf')],
  ['../../etc/passwd', Buffer.from('%PDF-1.4\n')],
  ['evil\u202egnp.pdf', Buffer.from('%PDF-1.4\n')],
  ['nul\u0000.pdf', Buffer.from('%PDF-1.4\n')],
  ['big.pdf', Buffer.concat([Buffer.from('%PDF-1.4\n'), Buffer.alloc(21 * 1024 * 1024)])],
  ['garbage.csv', Buffer.from([0, 1, 2, 3, 255, 254])],
  ['rows.csv', Buffer.from(`a,b\n${'1,2\n'.repeat(30_000)}`)],
  ['fake.xlsx', Buffer.from('PK\u0003\u0004 broken zip')],
  ['image.png', Buffer.from('89504e470d0a1a0a', 'hex')],
];
let filesTried = 0;
const fileFailures: string[] = [];
for (const upload of uploads) {
  for (const [name, bytes] of files) {
    filesTried += 1;
    let call = request(t.app).post(upload.path).set('cookie', cookie);
    if (upload.path.endsWith('/file')) call = request(t.app).put(upload.path).set('cookie', cookie);
    for (const [key, value] of Object.entries(upload.fields)) call = call.field(key, value);
    const response = await call.attach('file', bytes, name).catch((error: Error) => ({ status: 0, error }));
    if (response.status >= 500) fileFailures.push(`${upload.path} ${JSON.stringify(name)} → ${response.status}`);
  }
}
const verification = (await request(t.app).get('/api/trail/verification').set('cookie', cookie)).body;
console.log(JSON.stringify({ malformed, hostileFiles: { tried: filesTried, fiveXX: fileFailures.length }, trail: verification }, null, 2));
for (const failure of [...failures, ...fileFailures]) console.log('5xx:', failure);
await t.close();
process.exit(0);
