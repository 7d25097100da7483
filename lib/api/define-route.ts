import 'server-only';
import { getToken } from 'next-auth/jwt';
import { z, type ZodType } from 'zod';
import { findActiveUser } from '@/lib/db/users';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { isRole, type Role } from '@/lib/auth/roles';

export type RouteUser = { id: string; name: string; email: string; fleetId: string; roles: Role[] };

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

/** zod issues → readable per-field messages, for a form to show beside each field. */
export function fieldsFromZod(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

function parseOrThrow<T>(schema: ZodType<T>, value: unknown, what: string): T {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const fields = fieldsFromZod(r.error);
  const first = Object.entries(fields)[0];
  const message = first ? `${what}: ${first[0] === '_' ? '' : `${first[0]}: `}${first[1][0]}` : `${what} is not valid`;
  throw new AppError('invalid_body', message, fields);
}

function cookieMap(header: string | null): Map<string, string> {
  const map = new Map<string, string>();
  for (const part of (header ?? '').split(';')) {
    const i = part.indexOf('=');
    if (i > 0) map.set(part.slice(0, i).trim(), decodeURIComponent(part.slice(i + 1).trim()));
  }
  return map;
}

/** The signed-in user of a request, from the session cookie, checked against the database. */
export async function readRequestUser(req: Request): Promise<RouteUser | null> {
  const token = await getToken({
    req: { headers: req.headers, cookies: cookieMap(req.headers.get('cookie')) } as never,
    secret: getEnv().NEXTAUTH_SECRET,
  });
  if (!token?.uid) return null;
  const user = await findActiveUser(token.uid);
  if (!user) return null;
  return { ...user, roles: user.roles.filter(isRole) };
}

/**
 * Fields a JSON body carries that its schema does not know. zod would drop them silently; we
 * refuse them instead, so that a client never believes it set something that was not stored.
 */
function unknownFields(schema: ZodType, value: unknown): string[] {
  if (!(schema instanceof z.ZodObject) || schema._zod.def.catchall) return [];
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return [];
  const known = new Set(Object.keys(schema.shape));
  return Object.keys(value).filter((k) => !known.has(k));
}

function parseBodyOrThrow<T>(schema: ZodType<T>, value: unknown): T {
  const extra = unknownFields(schema, value);
  if (extra.length) {
    const shown = extra
      .slice(0, 5)
      .map((k) => `“${k.slice(0, 40)}”`)
      .join(', ');
    throw new AppError(
      'invalid_body',
      `Request: ${extra.length === 1 ? 'this field is' : 'these fields are'} not part of this request: ${shown}.`,
      Object.fromEntries(extra.slice(0, 20).map((k) => [k.slice(0, 40), ['is not a field of this request']])),
    );
  }
  return parseOrThrow(schema, value, 'Request');
}

async function readBytes(req: Request, maxBytes: number): Promise<Uint8Array> {
  const declared = Number(req.headers.get('content-length') ?? 0);
  const limit =
    maxBytes >= 1024 * 1024 ? `${Math.round(maxBytes / (1024 * 1024))} MB` : `${Math.round(maxBytes / 1024)} KB`;
  if (declared > maxBytes) throw new AppError('payload_too_large', `The file is larger than ${limit}.`);
  if (!req.body) throw new AppError('invalid_body', 'The upload is empty.');
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    let chunk: ReadableStreamReadResult<Uint8Array>;
    try {
      chunk = await reader.read();
    } catch {
      // The connection dropped mid-upload: nothing was stored, and the device sends it again.
      throw new AppError(
        'invalid_body',
        'The upload was cut off before it finished. Nothing was saved; send the photo again.',
      );
    }
    const { done, value } = chunk;
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      throw new AppError('payload_too_large', `The file is larger than ${limit}.`);
    }
    chunks.push(value);
  }
  if (size === 0) throw new AppError('invalid_body', 'The upload is empty.');
  const out = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

async function readBody(req: Request, maxBytes: number): Promise<unknown> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^application\/json\b/i.test(type)) {
    throw new AppError('unsupported_media_type', 'Send the request body as JSON (Content-Type: application/json).');
  }
  const text = await req.text();
  if (Buffer.byteLength(text) > maxBytes)
    throw new AppError('payload_too_large', `The request body is larger than ${Math.round(maxBytes / 1024)} KB.`);
  if (!text.trim()) throw new AppError('invalid_json', 'The request body is empty; JSON was expected.');
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new AppError('invalid_json', 'The request body is not valid JSON.');
  }
}

const unsafeMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * Cross-site request forgery: a state-changing request from a browser must come from our own
 * pages. Browsers say where a request comes from (Sec-Fetch-Site, and Origin on every POST);
 * a request that says neither is not from a browser and carries no ambient session to abuse.
 */
export function checkSameOrigin(req: Request): AppError | null {
  if (!unsafeMethods.has(req.method.toUpperCase())) return null;
  const site = req.headers.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none')
    return new AppError(
      'forbidden',
      'This request came from another site and was refused. Use RigCall from its own pages.',
    );
  const origin = req.headers.get('origin');
  if (!origin) return null;
  if (origin === 'null')
    return new AppError(
      'forbidden',
      'This request came from another site and was refused. Use RigCall from its own pages.',
    );
  const allowed = new Set<string>([new URL(req.url).origin]);
  const host = req.headers.get('x-forwarded-host') ?? req.headers.get('host');
  if (host)
    allowed.add(`${req.headers.get('x-forwarded-proto') ?? new URL(req.url).protocol.replace(':', '')}://${host}`);
  if (process.env.NEXTAUTH_URL) {
    try {
      allowed.add(new URL(process.env.NEXTAUTH_URL).origin);
    } catch {
      /* checked by getEnv */
    }
  }
  return allowed.has(origin)
    ? null
    : new AppError('forbidden', 'This request came from another site and was refused. Use RigCall from its own pages.');
}

/**
 * Every route handler goes through here, in order: same origin for writes (403) → session (401) → role (403) → params →
 * JSON body (400/415) → zod (422) → handler → AppError mapped by its code; anything else 500.
 */
export function defineRoute<P = undefined, B = undefined, Q = undefined>(
  opts: Options<P, B, Q> & { roles: 'public' },
  handler: Handler<P, B, Q, RouteUser | null>,
): (req: Request, ctx: RouteContext) => Promise<Response>;
export function defineRoute<P = undefined, B = undefined, Q = undefined>(
  opts: Options<P, B, Q> & { roles: readonly Role[] },
  handler: Handler<P, B, Q, RouteUser>,
): (req: Request, ctx: RouteContext) => Promise<Response>;
export function defineRoute<P, B, Q>(opts: Options<P, B, Q>, handler: Handler<P, B, Q, never>) {
  const route = async (req: Request, ctx: RouteContext): Promise<Response> => {
    try {
      const crossSite = checkSameOrigin(req);
      if (crossSite) throw crossSite;
      const user = await readRequestUser(req);
      if (opts.roles !== 'public') {
        if (!user) throw new AppError('unauthenticated', 'Sign in first.');
        const allowed = opts.roles;
        if (!allowed.some((r) => user.roles.includes(r))) {
          throw new AppError('forbidden', `This needs the ${allowed.join(' or ')} role.`);
        }
      }
      const params = opts.params ? parseOrThrow(opts.params, await ctx.params, 'Address') : (undefined as P);
      const query = opts.query
        ? parseOrThrow(opts.query, Object.fromEntries(new URL(req.url).searchParams), 'Query')
        : (undefined as Q);
      const bytes = opts.rawBody ? await readBytes(req, opts.rawBody.maxBytes) : null;
      const body =
        opts.body && !opts.rawBody
          ? parseBodyOrThrow(opts.body, await readBody(req, opts.maxBodyBytes ?? 256 * 1024))
          : (undefined as B);
      return await handler({ req, user: user as never, params, body, query, bytes });
    } catch (err) {
      if (err instanceof AppError) return errorResponse(err);
      console.error('[rigcall] unhandled error in route handler', req.method, new URL(req.url).pathname, err);
      return errorResponse(new AppError('internal', 'Something went wrong on our side. Try again in a moment.'));
    }
  };
  // What the route takes, for tests that walk every route (bad-input fuzzing).
  Object.defineProperty(route, 'routeSpec', {
    value: {
      roles: opts.roles,
      body: !!opts.body && !opts.rawBody,
      rawBody: !!opts.rawBody,
      params: !!opts.params,
      query: !!opts.query,
    } satisfies RouteSpec,
  });
  return route;
}

export type RouteSpec = {
  roles: readonly Role[] | 'public';
  body: boolean;
  rawBody: boolean;
  params: boolean;
  query: boolean;
};

/** The spec a route handler was defined with, or null for a handler not made by defineRoute. */
export function readRouteSpec(fn: unknown): RouteSpec | null {
  return (fn as { routeSpec?: RouteSpec } | null)?.routeSpec ?? null;
}
