import 'server-only';
import type { ZodType } from 'zod';
import { readSessionState, type SessionState } from '@/lib/auth/read-session-user';
import type { Role } from '@/lib/auth/roles';
import { AppError, findBusyDatabaseError } from '@/lib/errors';
import type { SessionUser } from '@/lib/schemas/session';
import { checkSameOrigin } from './check-same-origin';
import { parseOrThrow } from './parse-input';
import { parseBodyOrThrow, readBodyBytes, readJsonBody } from './read-body';
import { attachRouteSpec } from './route-spec';

type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

type Options<P, B, Q> = {
  /** Roles allowed to call the route; 'public' for routes that need no session (health, sign-in). */
  roles: readonly Role[] | 'public';
  params?: ZodType<P>;
  body?: ZodType<B>;
  query?: ZodType<Q>;
  /** Largest accepted body, in bytes. */
  maxBodyBytes?: number;
  /** Take the body as raw bytes (uploads) instead of JSON; the handler gets a Uint8Array. */
  rawBody?: { maxBytes: number };
  /** Open to a user who signed in with a temporary password (changing it; reading who they are). */
  allowTemporaryPassword?: boolean;
};

type Handler<P, B, Q, U> = (ctx: {
  req: Request;
  user: U;
  params: P;
  body: B;
  query: Q;
  bytes: Uint8Array | null;
}) => Promise<Response>;

const errorResponse = (e: AppError) => Response.json(e.toBody(), { status: e.status });

function checkRole(session: SessionState | null, allowed: readonly Role[] | 'public', allowTemporary: boolean) {
  if (allowed === 'public') return;
  if (!session) throw new AppError('unauthenticated', 'Sign in first.');
  if (session.mustChangePassword && !allowTemporary)
    throw new AppError(
      'forbidden',
      'You signed in with a temporary password. Change it first, on the change-password page, then carry on.',
    );
  const user = session.user;
  if (!allowed.some((r) => user.roles.includes(r)))
    throw new AppError('forbidden', `This needs the ${allowed.join(' or ')} role.`);
}

/**
 * Every route handler goes through here, in order: same origin for writes (403) → session (401) →
 * temporary password still to change (403) → role (403) → params →
 * JSON body (400/415) → zod (422) → handler → AppError mapped by its code; a database limit 503; anything else 500.
 */
export function defineRoute<P = undefined, B = undefined, Q = undefined>(
  opts: Options<P, B, Q> & { roles: 'public' },
  handler: Handler<P, B, Q, SessionUser | null>,
): (req: Request, ctx: RouteContext) => Promise<Response>;
export function defineRoute<P = undefined, B = undefined, Q = undefined>(
  opts: Options<P, B, Q> & { roles: readonly Role[] },
  handler: Handler<P, B, Q, SessionUser>,
): (req: Request, ctx: RouteContext) => Promise<Response>;
export function defineRoute<P, B, Q>(opts: Options<P, B, Q>, handler: Handler<P, B, Q, never>) {
  const route = async (req: Request, ctx: RouteContext): Promise<Response> => {
    try {
      const crossSite = checkSameOrigin(req);
      if (crossSite) throw crossSite;
      const session = await readSessionState(req.headers);
      checkRole(session, opts.roles, opts.allowTemporaryPassword === true);
      // A public route sees a temporary-password session as nobody.
      const user = session && (!session.mustChangePassword || opts.allowTemporaryPassword) ? session.user : null;
      const params = opts.params ? parseOrThrow(opts.params, await ctx.params, 'Address') : (undefined as P);
      const query = opts.query
        ? parseOrThrow(opts.query, Object.fromEntries(new URL(req.url).searchParams), 'Query')
        : (undefined as Q);
      const bytes = opts.rawBody ? await readBodyBytes(req, opts.rawBody.maxBytes) : null;
      const body =
        opts.body && !opts.rawBody
          ? parseBodyOrThrow(opts.body, await readJsonBody(req, opts.maxBodyBytes ?? 256 * 1024))
          : (undefined as B);
      return await handler({ req, user: user as never, params, body, query, bytes });
    } catch (err) {
      if (err instanceof AppError) return errorResponse(err);
      // A held lock, a statement past its limit, no free connection: busy, not broken (503).
      const busy = findBusyDatabaseError(err);
      if (busy) {
        console.warn('[rigcall] database busy', req.method, new URL(req.url).pathname, (err as Error).message);
        return errorResponse(busy);
      }
      console.error('[rigcall] unhandled error in route handler', req.method, new URL(req.url).pathname, err);
      return errorResponse(new AppError('internal', 'Something went wrong on our side. Try again in a moment.'));
    }
  };
  return attachRouteSpec(route, {
    roles: opts.roles,
    body: !!opts.body && !opts.rawBody,
    rawBody: !!opts.rawBody,
    params: !!opts.params,
    query: !!opts.query,
  });
}
