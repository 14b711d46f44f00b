import { Router } from 'express';
import { openApiDocument } from './openapi-document.js';

/** GET /api/openapi.json, built once on first request (the routes do not change at run time). */
export function openApiRoutes(api: Router): Router {
  const router = Router();
  let document: unknown;
  router.get('/', (_req, res) => {
    document ??= openApiDocument(api);
    res.json(document);
  });
  return router;
}
