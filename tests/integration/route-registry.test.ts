import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import '@/lib/server/api';
import { registeredRoutes } from '@/lib/server/http';

const APP_API = fileURLToPath(new URL('../../app/api', import.meta.url));
// next-auth's own endpoints are not part of the product API.
const OUTSIDE_REGISTRY = ['auth/[...nextauth]'];

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? routeFiles(p) : name === 'route.ts' ? [p] : [];
  });
}

describe('the route registry', () => {
  const mounted = routeFiles(APP_API)
    .filter((f) => !OUTSIDE_REGISTRY.some((o) => f.includes(o)))
    .flatMap((file) => {
      const folder = relative(APP_API, file).replace(/\/route\.ts$/, '');
      const path = `/api/${folder}`.replace(/\[([^\]]+)\]/g, '{$1}');
      const methods = [...readFileSync(file, 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE) = toHandler\(/g)].map((m) => m[1]);
      return methods.map((method) => `${method} ${path}`);
    })
    .sort();
  const registered = registeredRoutes()
    .map((r) => `${r.method} ${r.path}`)
    .sort();

  it('every mounted API route is declared in the registry, and every declared route is mounted', () => {
    expect(mounted.length).toBeGreaterThan(10);
    expect(mounted).toEqual(registered);
  });

  it('every route declares a response schema and, for lab routes, a policy action', () => {
    for (const r of registeredRoutes()) {
      expect(r.response, r.id).toBeDefined();
      if (r.path.includes('{lab}') && r.access.kind === 'lab') expect(r.access.action, r.id).toMatch(/^[a-z]+:[a-z]+$/);
    }
  });

  it('route files stay thin: no route file holds logic beyond mounting', () => {
    for (const file of routeFiles(APP_API).filter((f) => !OUTSIDE_REGISTRY.some((o) => f.includes(o)))) {
      expect(readFileSync(file, 'utf8').split('\n').length, file).toBeLessThan(15);
    }
  });
});
