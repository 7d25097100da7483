// Defect 4 of issue 16: sign-in throttling keyed on an address nobody can choose. Under plain
// `next start` the client writes X-Forwarded-For itself (Next only fills it in when absent), so it
// is trusted only behind TRUSTED_PROXY_COUNT proxies; failures slow the account (or the account
// and address pair) down with a growing delay instead of locking it for everyone.
import { randomUUID } from 'node:crypto';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { authOptions } from '@/lib/auth/config';
import { findSignInDelay, readClientAddress, signInDelaySeconds, signInKeys } from '@/lib/auth/rate-limit';
import { makeUser } from '../../../db/factories';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { getTestDb } from '../../setup/test-db';

const db = getTestDb();
let f: FleetFixture;
beforeAll(async () => {
  f = await makeFleetFixture(db, 'Throttle fleet');
});
afterAll(() => db.destroy());

type Authorize = (c: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
const authorize = (authOptions.providers[0] as unknown as { options: { authorize: Authorize } }).options.authorize;
const spoofed = () => `198.51.100.${Math.floor(Math.random() * 250)}`;
const tryFrom = (email: string, password: string, xff: string) =>
  authorize({ email, password }, { headers: { 'x-forwarded-for': xff } });
const waitOf = async (p: Promise<unknown>) => {
  try {
    await p;
    return 0;
  } catch (err) {
    const m = /wait (\d+) (second|minute)/i.exec((err as Error).message);
    if (!m) throw err;
    return Number(m[1]) * (m[2]!.startsWith('minute') ? 60 : 1);
  }
};

describe('sign-in throttling (issue 16, defect 4)', () => {
  it('defect 4: X-Forwarded-For counts only behind the configured number of trusted proxies', () => {
    const headers = { 'x-forwarded-for': '203.0.113.7, 10.0.0.2, 192.0.2.1' };
    // Default: no proxy trusted, the header is whatever the client wrote.
    expect(readClientAddress(headers)).toBeNull();
    expect(readClientAddress(headers, 0)).toBeNull();
    // One proxy in front: the address it saw is the last entry; two: the one before.
    expect(readClientAddress(headers, 1)).toBe('192.0.2.1');
    expect(readClientAddress(headers, 2)).toBe('10.0.0.2');
    // Fewer entries than trusted proxies: nothing trustworthy.
    expect(readClientAddress({ 'x-forwarded-for': '192.0.2.1' }, 2)).toBeNull();
  });

  it('defect 4: wrong passwords from spoofed addresses slow the account down, not lock it for 15 minutes', async () => {
    const email = `spray-${randomUUID().slice(0, 8)}@test.example`;
    await makeUser(db, { fleetId: f.fleet.id, roles: ['driver'], email, password: 'the right password' });
    const waits: number[] = [];
    for (let i = 0; i < 8; i++) {
      // Each try waits out the delay before it, the way a patient attacker would.
      await sql`update sign_in_throttle set updated_at = now() - interval '301 seconds' where key like ${`%${email}%`}`.execute(
        db,
      );
      waits.push(await waitOf(tryFrom(email, 'wrong', spoofed())));
    }
    // The right password right after the last failure, from the real user.
    const wait = await waitOf(tryFrom(email, 'the right password', spoofed()));
    expect(wait, 'no fifteen-minute lock-out').toBeLessThan(15 * 60);
    expect(wait).toBeGreaterThan(0);
    // Once the growing delay has passed, the right password works although the failures remain.
    await sql`update sign_in_throttle set updated_at = now() - make_interval(secs => ${wait + 1}) where key like ${`%${email}%`}`.execute(
      db,
    );
    expect(await tryFrom(email, 'the right password', spoofed())).toMatchObject({ email });
  });

  it('defect 4: the delay grows with each failure and has a ceiling', () => {
    const d = [1, 2, 3, 4, 5, 6, 7, 8, 20, 100].map((n) => signInDelaySeconds(n, 'pair'));
    expect(d.slice(0, 3)).toEqual([0, 0, 0]); // a few typos cost nothing
    for (let i = 3; i < d.length - 1; i++) expect(d[i + 1]!).toBeGreaterThanOrEqual(d[i]!);
    expect(d[3]!).toBeGreaterThan(0);
    expect(Math.max(...d)).toBeLessThanOrEqual(5 * 60);
  });

  it('defect 4: behind a trusted proxy, failures from one address do not slow the same account elsewhere', async () => {
    const email = `pair-${randomUUID().slice(0, 8)}@test.example`;
    const { recordSignInFailure } = await import('@/lib/auth/rate-limit');
    const attacker = signInKeys(email, '192.0.2.66');
    for (let i = 0; i < 10; i++) await recordSignInFailure(attacker);
    expect(await findSignInDelay(attacker)).toBeGreaterThan(0);
    expect(await findSignInDelay(signInKeys(email, '192.0.2.10'))).toBe(0);
  });
});
