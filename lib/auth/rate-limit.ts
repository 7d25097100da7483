import 'server-only';
import { sql } from 'kysely';
import { getDb, type DB } from '@/lib/db';
import { getEnv } from '@/lib/env';

/**
 * Sign-in throttling, kept in PostgreSQL so every app instance counts the same failures.
 *
 * Failures are counted per account and address pair when the client's address is known, and per
 * account when it is not. A few failures cost nothing; after that each one makes the next try
 * wait longer (doubling, up to a ceiling), and the count is forgotten after a quiet spell. There
 * is no hard lock-out: a stranger cannot keep a driver out for a quarter of an hour, and every
 * refused try is refused before bcrypt runs, so guessing costs the server nothing.
 *
 * The address: under plain `next start` the X-Forwarded-For header is whatever the client wrote
 * (Next only fills it in from the socket when the client sent none), and the socket address is
 * not available to a route handler. So it is trusted only when TRUSTED_PROXY_COUNT says how many
 * proxies in front of the app append to it; with the default 0 there is no address, and the
 * account alone is slowed down. A known address also has a roomier limit of its own, for a
 * depot full of drivers, against one address trying many accounts.
 */
export const signInLimits = {
  /** Failures forgotten after this long without another. */
  forgetSeconds: 15 * 60,
  pair: { free: 3, firstDelaySeconds: 2, maxDelaySeconds: 5 * 60 },
  address: { free: 30, firstDelaySeconds: 2, maxDelaySeconds: 15 * 60 },
} as const;

type Scope = 'pair' | 'address';

/** Seconds the next try must wait after `failures` failures in a row (0 while they are free). */
export function signInDelaySeconds(failures: number, scope: Scope): number {
  const l = signInLimits[scope];
  if (failures <= l.free) return 0;
  return Math.min(l.maxDelaySeconds, l.firstDelaySeconds * 2 ** (failures - l.free - 1));
}

export type ThrottleKeys = { keys: { key: string; scope: Scope }[]; account: string };

/** The counters a sign-in attempt is checked against and counted on. */
export function signInKeys(email: string, address: string | null): ThrottleKeys {
  const account = email.trim().toLowerCase();
  return {
    account,
    keys: address
      ? [
          { key: `pair:${account}|${address}`, scope: 'pair' },
          { key: `address:${address}`, scope: 'address' },
        ]
      : [{ key: `account:${account}`, scope: 'pair' }],
  };
}

type HeaderBag = Record<string, unknown> | Headers | undefined;

/**
 * The client's address, from X-Forwarded-For as written by the nearest `trustedProxies` proxies
 * (the entry the outermost trusted one appended), or null when no proxy is trusted or the header
 * has fewer entries than that.
 */
export function readClientAddress(headers: HeaderBag, trustedProxies = getEnv().TRUSTED_PROXY_COUNT): string | null {
  if (!headers || trustedProxies < 1) return null;
  const raw = headers instanceof Headers ? headers.get('x-forwarded-for') : headers['x-forwarded-for'];
  const value = Array.isArray(raw) ? raw.join(',') : typeof raw === 'string' ? raw : '';
  const parts = value
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  const entry = parts[parts.length - trustedProxies];
  return entry ? entry.slice(0, 64) : null;
}

/** Seconds until this sign-in may be tried, or 0 when it may go ahead now. */
export async function findSignInDelay(k: ThrottleKeys, db: DB = getDb()): Promise<number> {
  const rows = await db
    .selectFrom('signInThrottle')
    .select(['key', 'failures', sql<number>`extract(epoch from (now() - updated_at))`.as('since')])
    .where(
      'key',
      'in',
      k.keys.map((x) => x.key),
    )
    .execute();
  let wait = 0;
  for (const r of rows) {
    const scope = k.keys.find((x) => x.key === r.key)?.scope ?? 'pair';
    const since = Number(r.since);
    if (since > signInLimits.forgetSeconds) continue;
    wait = Math.max(wait, Math.ceil(signInDelaySeconds(r.failures, scope) - since));
  }
  return Math.max(0, wait);
}

/** Count one failed sign-in on each counter (a count left alone long enough starts again). */
export async function recordSignInFailure(k: ThrottleKeys, db: DB = getDb()): Promise<void> {
  const forget = signInLimits.forgetSeconds;
  for (const { key } of k.keys) {
    await sql`
      INSERT INTO sign_in_throttle (key, failures, window_started_at, updated_at) VALUES (${key}, 1, now(), now())
      ON CONFLICT (key) DO UPDATE SET
        failures = CASE WHEN sign_in_throttle.updated_at < now() - make_interval(secs => ${forget}) THEN 1 ELSE sign_in_throttle.failures + 1 END,
        window_started_at = CASE WHEN sign_in_throttle.updated_at < now() - make_interval(secs => ${forget}) THEN now() ELSE sign_in_throttle.window_started_at END,
        updated_at = now()`.execute(db);
  }
  // Old counts are of no use; drop a few on the way.
  await sql`DELETE FROM sign_in_throttle WHERE key IN (SELECT key FROM sign_in_throttle WHERE updated_at < now() - make_interval(secs => ${forget * 4}) LIMIT 100)`.execute(
    db,
  );
}

/** A good sign-in clears its account's counter (not the address's: one good password does not vouch for a depot). */
export async function clearSignInFailures(k: ThrottleKeys, db: DB = getDb()): Promise<void> {
  const mine = k.keys.filter((x) => !x.key.startsWith('address:')).map((x) => x.key);
  if (mine.length) await db.deleteFrom('signInThrottle').where('key', 'in', mine).execute();
}

export class SignInLockedError extends Error {
  constructor(readonly retryAfterSeconds: number) {
    const s = Math.max(1, Math.ceil(retryAfterSeconds));
    super(`Too many failed sign-ins. Wait ${s < 120 ? `${s} seconds` : `${Math.ceil(s / 60)} minutes`} and try again.`);
    this.name = 'SignInLockedError';
  }
}
