import type { Router } from 'express';

/**
 * Where each router is mounted, recorded as it is mounted, so the OpenAPI document can name
 * every route's full path (Express does not keep mount paths it can give back).
 */
export interface Mount {
  path: string;
  router: Router;
}

const children = new WeakMap<Router, Mount[]>();

export function mountRouter(parent: Router, path: string, child: Router): void {
  parent.use(path, child);
  children.set(parent, [...(children.get(parent) ?? []), { path, router: child }]);
}

export function mountsOf(parent: Router): Mount[] {
  return children.get(parent) ?? [];
}
