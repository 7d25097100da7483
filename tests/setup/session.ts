// Real next-auth session cookies for calling route handlers directly in integration tests.
import { encode } from 'next-auth/jwt';

export async function sessionCookieFor(user: {
  id: string;
  name?: string;
  email?: string;
  fleetId: string;
  roles: string[];
  sessionVersion?: number;
}): Promise<string> {
  const secret = process.env.NEXTAUTH_SECRET;
  if (!secret) throw new Error('NEXTAUTH_SECRET is not set');
  const token = await encode({
    secret,
    token: {
      uid: user.id,
      name: user.name ?? 'Test',
      email: user.email ?? 'test@test.example',
      fleetId: user.fleetId,
      roles: user.roles as never,
      sub: user.id,
      // A session begun now, under the account's session version (1 until something ends sessions).
      sv: user.sessionVersion ?? 1,
      signedInAt: Math.floor(Date.now() / 1000),
    },
  });
  return `next-auth.session-token=${token}`;
}

type CallInit = { method?: string; cookie?: string; json?: unknown; body?: BodyInit; headers?: Record<string, string> };

/** A Request as the browser would send it, to hand to an exported GET/POST/PATCH. */
export function makeRequest(path: string, init: CallInit = {}): Request {
  const headers: Record<string, string> = { ...init.headers };
  if (init.cookie) headers.cookie = init.cookie;
  if (init.json !== undefined) headers['content-type'] = 'application/json';
  // What a browser sends with a write from our own pages (define-route refuses other origins).
  if (init.method && init.method !== 'GET' && !Object.keys(headers).some((h) => h.toLowerCase() === 'origin'))
    headers.origin = 'http://127.0.0.1:3100';
  return new Request(`http://127.0.0.1:3100${path}`, {
    method: init.method ?? 'GET',
    headers,
    body: init.json !== undefined ? JSON.stringify(init.json) : init.body,
  });
}

type RouteFn = (
  req: Request,
  ctx: { params: Promise<Record<string, string | string[] | undefined>> },
) => Promise<Response>;

/** Call a route handler with path params, the way Next does. */
export function callRoute(fn: RouteFn, req: Request, params: Record<string, string> = {}): Promise<Response> {
  return fn(req, { params: Promise.resolve(params) });
}
