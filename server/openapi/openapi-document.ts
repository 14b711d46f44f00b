import type { Router } from 'express';
import type { z } from 'zod';
import { createDocument, type ZodOpenApiPathsObject } from 'zod-openapi';
import { ErrorBody } from '../contracts/errors.js';
import { validatedSchemas } from '../middleware/validate.js';
import { mountsOf } from './mounts.js';

export interface RouteInfo {
  method: string;
  path: string;
  schemas: { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType; response?: z.ZodType };
}

interface Layer {
  route?: { path: string; methods: Record<string, boolean>; stack: Array<{ handle: never }> };
}

/** Every route under a router, with its full path and the zod schemas its validate() checks. */
export function collectRoutes(router: Router, prefix = ''): RouteInfo[] {
  const routes: RouteInfo[] = [];
  for (const layer of router.stack as unknown as Layer[]) {
    if (!layer.route) continue;
    const schemas = layer.route.stack.map((entry) => validatedSchemas.get(entry.handle)).find(Boolean) ?? {};
    for (const method of Object.keys(layer.route.methods)) {
      routes.push({ method, path: `${prefix}${layer.route.path === '/' ? '' : layer.route.path}` || '/', schemas });
    }
  }
  for (const mount of mountsOf(router)) routes.push(...collectRoutes(mount.router, `${prefix}${mount.path}`));
  return routes;
}

const openApiPath = (path: string) => path.replace(/:(\w+)/g, '{$1}');

/** The OpenAPI 3.1 document of the API, from the same zod schemas the routes validate with. */
export function openApiDocument(api: Router): object {
  const paths: ZodOpenApiPathsObject = {};
  for (const route of collectRoutes(api, '/api')) {
    const path = openApiPath(route.path);
    const parameters = [...route.path.matchAll(/:(\w+)/g)].map((match) => match[1]!);
    const operation: Record<string, unknown> = {
      operationId: `${route.method}${route.path.replace(/[/:{}-]+(\w)?/g, (_, c: string | undefined) => (c ? c.toUpperCase() : ''))}`,
      requestParams: {
        ...(route.schemas.params ? { path: route.schemas.params } : {}),
        ...(route.schemas.query ? { query: route.schemas.query } : {}),
      },
      responses: {
        '200': {
          description: 'Success (201 for a creation, 204 when nothing is returned)',
          ...(route.schemas.response ? { content: { 'application/json': { schema: route.schemas.response } } } : {}),
        },
        '400': { description: 'Invalid input; `fields` names each invalid input', content: { 'application/json': { schema: ErrorBody } } },
        '401': { description: 'Not signed in' },
        '403': { description: 'Not allowed for this role or site' },
      },
    };
    if (!route.schemas.params && parameters.length) {
      operation.parameters = parameters.map((name) => ({ name, in: 'path', required: true, schema: { type: 'string' } }));
    }
    if (route.schemas.body) operation.requestBody = { content: { 'application/json': { schema: route.schemas.body } } };
    paths[path] = { ...(paths[path] ?? {}), [route.method]: operation };
  }
  return createDocument({
    openapi: '3.1.0',
    info: {
      title: 'Decant API',
      version: '0.1.0',
      description:
        'Compliance records of industrial sites discharging oily wastewater. Errors answer { error: { code, message, fields? } }.',
    },
    paths,
  });
}
