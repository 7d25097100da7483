// Every route handler under app/api, found on disk and imported, with what it takes (from
// defineRoute's spec) and real ids to put in its path, so a test can throw input at all of them.
import fs from 'node:fs';
import path from 'node:path';
import { readRouteSpec, type RouteSpec } from '@/lib/api/route-spec';

export type RouteFn = (
  req: Request,
  ctx: { params: Promise<Record<string, string | string[] | undefined>> },
) => Promise<Response>;
export type CatalogRoute = { route: string; method: string; fn: RouteFn; spec: RouteSpec; paramNames: string[] };

const apiDir = path.resolve(__dirname, '../../../app/api');
const methods = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;

/** Route files under app/api, as `inspections/[id]/steps`. */
export function listRouteFiles(): string[] {
  const found: string[] = [];
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const abs = path.join(dir, e.name);
      if (e.isDirectory()) walk(abs);
      else if (e.name === 'route.ts') found.push(path.relative(apiDir, dir).split(path.sep).join('/'));
    }
  };
  walk(apiDir);
  return found.sort();
}

/** Every exported method made with defineRoute (next-auth's own handler is not). */
export async function loadRouteCatalog(): Promise<CatalogRoute[]> {
  const out: CatalogRoute[] = [];
  for (const route of listRouteFiles()) {
    const mod = (await import(path.join(apiDir, route, 'route.ts'))) as Record<string, unknown>;
    for (const method of methods) {
      const fn = mod[method];
      const spec = readRouteSpec(fn);
      if (typeof fn !== 'function' || !spec) continue;
      const paramNames = [...route.matchAll(/\[([^\]]+)\]/g)].map((m) => m[1]!);
      out.push({ route, method, fn: fn as RouteFn, spec, paramNames });
    }
  }
  return out;
}

/** The URL path of a route with these params filled in. */
export function pathOf(route: string, params: Record<string, string>): string {
  return `/api/${route.replace(/\[([^\]]+)\]/g, (_m, name: string) => encodeURIComponent(params[name] ?? 'x'))}`;
}
