import 'server-only';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';

const unsafeMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const refused = () =>
  new AppError('forbidden', 'This request came from another site and was refused. Use RigCall from its own pages.');

/**
 * Our own origin: the configured public URL (NEXTAUTH_URL). Headers such as X-Forwarded-Host are
 * written by whoever sends the request and never widen it. Without a configured URL (a bare
 * development server), the URL the request arrived at.
 */
function ownOrigin(req: Request): string {
  try {
    return new URL(getEnv().NEXTAUTH_URL ?? req.url).origin;
  } catch {
    return new URL(req.url).origin;
  }
}

/**
 * Cross-site request forgery: a state-changing request from a browser must come from our own
 * pages. Browsers say where a request comes from (Sec-Fetch-Site, and Origin on every POST);
 * a request that says neither is not from a browser and carries no ambient session to abuse.
 */
export function checkSameOrigin(req: Request): AppError | null {
  if (!unsafeMethods.has(req.method.toUpperCase())) return null;
  const site = req.headers.get('sec-fetch-site');
  if (site && site !== 'same-origin' && site !== 'none') return refused();
  const origin = req.headers.get('origin');
  if (!origin) return null;
  if (origin === 'null') return refused();
  return origin === ownOrigin(req) ? null : refused();
}
