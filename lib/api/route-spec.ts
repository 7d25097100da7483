import 'server-only';
import type { Role } from '@/lib/auth/roles';

/** What a route takes, for tests that walk every route (bad-input fuzzing). */
export type RouteSpec = {
  roles: readonly Role[] | 'public';
  body: boolean;
  rawBody: boolean;
  params: boolean;
  query: boolean;
};

/** Attach a route's spec to its handler function. */
export function attachRouteSpec<F extends object>(fn: F, spec: RouteSpec): F {
  Object.defineProperty(fn, 'routeSpec', { value: spec });
  return fn;
}

/** The spec a route handler was defined with, or null for a handler not made by defineRoute. */
export function readRouteSpec(fn: unknown): RouteSpec | null {
  return (fn as { routeSpec?: RouteSpec } | null)?.routeSpec ?? null;
}
