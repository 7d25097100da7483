import 'server-only';
import { AppError } from '@/lib/errors';

const unsafeMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const refused = () =>
  new AppError('forbidden', 'This request came from another site and was refused. Use RigCall from its own pages.');

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
  return allowed.has(origin) ? null : refused();
}
