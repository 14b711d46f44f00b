import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../helpers/test-app.js';

interface ExpressLayer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: ExpressLayer[] };
}

/** Every route Express actually serves, found by walking its routers (not through Decant's own registry). */
function countServedRoutes(stack: ExpressLayer[]): number {
  let count = 0;
  for (const layer of stack) {
    if (layer.route) count += Object.keys(layer.route.methods).length;
    else if (layer.handle?.stack) count += countServedRoutes(layer.handle.stack);
  }
  return count;
}

describe('GET /api/openapi.json', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('is an OpenAPI 3.1 document that covers every route the app serves', async () => {
    const response = await request(t.app).get('/api/openapi.json').expect(200);
    expect(response.body.openapi).toBe('3.1.0');
    const operations = Object.values(response.body.paths as Record<string, Record<string, unknown>>).reduce(
      (n, item) => n + Object.keys(item).length,
      0,
    );
    const served = countServedRoutes((t.app as unknown as { router: { stack: ExpressLayer[] } }).router.stack);
    // The client's catch-all is not mounted in API tests; every served route is an /api route.
    expect(operations).toBe(served);
    expect(operations).toBeGreaterThan(50);
  });

  it("documents the period summary's stable field names, each limit row's with a description", async () => {
    const { body } = await request(t.app).get('/api/openapi.json').expect(200);
    const summary = body.paths['/api/periods/{id}/summary'].get.responses['200'].content['application/json'].schema;
    const resolve = (schema: { $ref?: string }) => (schema.$ref ? body.components.schemas[schema.$ref.split('/').pop()!] : schema);
    const rowSchema = resolve(resolve(summary).properties.rows.items ?? resolve(summary.properties.rows).items);
    for (const field of [
      'limitId',
      'parameter',
      'statistic',
      'unit',
      'limitValue',
      'computedValue',
      'exceeded',
      'samplesTaken',
      'samplesRequired',
    ]) {
      expect(rowSchema.properties, field).toHaveProperty(field);
    }
    expect(rowSchema.properties.computedValue.description).toMatch(/highest daily discharge/);
  });

  it('describes bodies and parameters from the routes’ own zod schemas', async () => {
    const { body } = await request(t.app).get('/api/openapi.json').expect(200);
    const createShipment = body.paths['/api/shipments'].post;
    const schema = createShipment.requestBody.content['application/json'].schema;
    const resolved = schema.$ref ? body.components.schemas[schema.$ref.split('/').pop()] : schema;
    expect(resolved.properties.transporterEpaId.pattern).toBeDefined();
    expect(
      body.paths['/api/periods/{id}/summary'].get.parameters.some((p: { name: string; in: string }) => p.name === 'id' && p.in === 'path'),
    ).toBe(true);
  });
});
