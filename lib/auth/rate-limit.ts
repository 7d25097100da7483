import 'server-only';
import { sql } from 'kysely';
import { getDb, type DB } from '@/lib/db';

/**
 * Sign-in throttling, kept in PostgreSQL so every app instance counts the same failures.
 * An account locks after `account.max` failed sign-ins within the window; an address after
 * `address.max` (one address may be a depot full of drivers, so its limit is higher).
 */
export const signInLimits = {
  windowSeconds: 15 * 60,
  account: { max: 5 },
  address: { max: 30 },
} as const;

export type ThrottleKeys = { account: string; address: string | null };

const keysOf = (k: ThrottleKeys) => [
  `account:${k.account.trim().toLowerCase()}`,
  ...(k.address ? [`address:${k.address}`] : []),
];
const limitOf = (key: string) => (key.startsWith('account:') ? signInLimits.account.max : signInLimits.address.max);

/** The client address of a sign-in request: the nearest proxy's entry of X-Forwarded-For. */
export function readClientAddress(headers: Record<string, unknown> | Headers | undefined): string | null {
  if (!headers) return null;
  const get = (name: string) =>
    headers instanceof Headers ? headers.get(name) : (headers[name] as string | string[] | undefined);
  const raw = get('x-forwarded-for') ?? get('x-real-ip');
  const value = Array.isArray(raw) ? raw.join(',') : raw;
  if (!value) return null;
  const parts = value
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  const last = parts[parts.length - 1];
  return last ? last.slice(0, 64) : null;
}

/** Seconds until the account or the address may try again, or 0 when a sign-in may go ahead. */
export async function findSignInLockout(k: ThrottleKeys, db: DB = getDb()): Promise<number> {
  const keys = keysOf(k);
  const rows = await db
    .selectFrom('signInThrottle')
    .select([
      'key',
      'failures',
      sql<number>`extract(epoch from (window_started_at + make_interval(secs => ${signInLimits.windowSeconds}) - now()))`.as(
        'remaining',
      ),
    ])
    .where('key', 'in', keys)
    .execute();
  let wait = 0;
  for (const r of rows)
    if (r.failures >= limitOf(r.key) && Number(r.remaining) > 0) wait = Math.max(wait, Math.ceil(Number(r.remaining)));
  return wait;
}

/** Count one failed sign-in against the account and the address (a new window once the old one ends). */
export async function recordSignInFailure(k: ThrottleKeys, db: DB = getDb()): Promise<void> {
  const window = signInLimits.windowSeconds;
  for (const key of keysOf(k)) {
    await sql`
      INSERT INTO sign_in_throttle (key, failures, window_started_at, updated_at) VALUES (${key}, 1, now(), now())
      ON CONFLICT (key) DO UPDATE SET
        failures = CASE WHEN sign_in_throttle.window_started_at < now() - make_interval(secs => ${window}) THEN 1 ELSE sign_in_throttle.failures + 1 END,
        window_started_at = CASE WHEN sign_in_throttle.window_started_at < now() - make_interval(secs => ${window}) THEN now() ELSE sign_in_throttle.window_started_at END,
        updated_at = now()`.execute(db);
  }
  // Old windows are of no use; drop a few on the way.
  await sql`DELETE FROM sign_in_throttle WHERE key IN (SELECT key FROM sign_in_throttle WHERE updated_at < now() - make_interval(secs => ${window * 4}) LIMIT 100)`.execute(
    db,
  );
}

/** A good sign-in clears the account's count (not the address's: one good password does not vouch for a depot). */
export async function clearSignInFailures(k: ThrottleKeys, db: DB = getDb()): Promise<void> {
  await db.deleteFrom('signInThrottle').where('key', '=', `account:${k.account.trim().toLowerCase()}`).execute();
}

export class SignInLockedError extends Error {
  constructor(readonly retryAfterSeconds: number) {
    super(`Too many failed sign-ins. Wait ${Math.max(1, Math.ceil(retryAfterSeconds / 60))} minutes and try again.`);
    this.name = 'SignInLockedError';
  }
}
