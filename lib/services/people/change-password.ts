import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { sql } from 'kysely';
import { getDb, type DB } from '@/lib/db';
import { bumpSessionVersion } from '@/lib/db/users';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { sendMail } from '@/lib/mail';
import { findPasswordProblem } from '@/lib/schemas/password';
import { recordAudit } from '../platform/record-audit';

/** bcrypt cost for passwords people choose. */
const bcryptCost = 11;
/** A "forgot password" link works this long, once. */
export const resetLinkMinutes = 60;

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

function refuseNewPassword(message: string): never {
  throw new AppError('invalid_body', `New password: ${message}`, { newPassword: [message] });
}

/**
 * Store a new password and end every session of the account (the caller re-issues its own).
 * Returns the new session version. A temporary password is replaced for good, and open reset
 * links stop working.
 */
async function storeNewPassword(
  trx: DB,
  u: { id: string; fleetId: string },
  newPassword: string,
  action: 'user.password_changed' | 'user.password_reset',
): Promise<number> {
  const passwordHash = await bcrypt.hash(newPassword, bcryptCost);
  await trx
    .updateTable('appUser')
    .set({
      passwordHash,
      mustChangePassword: false,
      temporaryPasswordExpiresAt: null,
      passwordChangedAt: new Date(),
      updatedAt: new Date(),
    })
    .where('id', '=', u.id)
    .execute();
  await trx
    .updateTable('passwordReset')
    .set({ usedAt: new Date() })
    .where('userId', '=', u.id)
    .where('usedAt', 'is', null)
    .execute();
  await recordAudit(trx, { fleetId: u.fleetId, actorId: u.id, action, entity: 'app_user', entityId: u.id, detail: {} });
  return bumpSessionVersion(trx, { userId: u.id });
}

/** Change one's own password: the current one, then a new one that passes the policy. */
export async function changePassword(opts: {
  userId: string;
  fleetId: string;
  currentPassword: string;
  newPassword: string;
}): Promise<{ sessionVersion: number }> {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const u = await trx
        .selectFrom('appUser')
        .select(['id', 'fleetId', 'email', 'name', 'passwordHash'])
        .where('id', '=', opts.userId)
        .where('fleetId', '=', opts.fleetId)
        .where('active', '=', true)
        .forUpdate()
        .executeTakeFirst();
      if (!u) throw new AppError('unauthenticated', 'Sign in first.');
      if (!(await bcrypt.compare(opts.currentPassword, u.passwordHash)))
        throw new AppError('invalid_body', 'Current password: that is not your current password.', {
          currentPassword: ['That is not your current password.'],
        });
      const problem = findPasswordProblem(opts.newPassword, u);
      if (problem) refuseNewPassword(problem);
      if (await bcrypt.compare(opts.newPassword, u.passwordHash))
        refuseNewPassword('Pick a password other than the one you have now.');
      return { sessionVersion: await storeNewPassword(trx, u, opts.newPassword, 'user.password_changed') };
    });
}

/**
 * "Forgot password": when the address belongs to an active account, mail it a link with a
 * random token; only the token's SHA-256 is stored. The caller answers the same either way.
 * One link per account per two minutes, so the form cannot be used to flood a mailbox.
 */
export async function requestPasswordReset({ email }: { email: string }): Promise<void> {
  const db = getDb();
  const u = await db
    .selectFrom('appUser')
    .select(['id', 'fleetId', 'name', 'email'])
    .where('email', '=', email.toLowerCase())
    .where('active', '=', true)
    .executeTakeFirst();
  if (!u) return;
  const recent = await db
    .selectFrom('passwordReset')
    .select('id')
    .where('userId', '=', u.id)
    .where('createdAt', '>', sql<Date>`now() - interval '2 minutes'`)
    .executeTakeFirst();
  if (recent) return;
  const token = randomBytes(32).toString('base64url');
  await db
    .insertInto('passwordReset')
    .values({
      fleetId: u.fleetId,
      userId: u.id,
      tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + resetLinkMinutes * 60_000),
    })
    .execute();
  const base = (getEnv().NEXTAUTH_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
  const link = `${base}/reset-password?token=${token}`;
  const text = [
    `Hello ${u.name},`,
    '',
    'Someone asked to set a new RigCall password for this address. To choose one, open:',
    '',
    link,
    '',
    `The link works once, for ${resetLinkMinutes} minutes. If you did not ask, ignore this message: your password stays as it is.`,
  ].join('\n');
  try {
    await sendMail({ fleetId: u.fleetId, to: [u.email], subject: 'RigCall: choose a new password', text });
  } catch (err) {
    console.error('[rigcall] password reset mail failed', err);
  }
}

/** Set a new password with a "forgot password" link: once, before it expires; ends every session. */
export async function resetPassword({ token, newPassword }: { token: string; newPassword: string }): Promise<void> {
  await getDb()
    .transaction()
    .execute(async (trx) => {
      const row = await trx
        .selectFrom('passwordReset as r')
        .innerJoin('appUser as u', 'u.id', 'r.userId')
        .select(['r.id as resetId', 'u.id', 'u.fleetId', 'u.email', 'u.name'])
        .where('r.tokenHash', '=', hashToken(token))
        .where('r.usedAt', 'is', null)
        .where('r.expiresAt', '>', sql<Date>`now()`)
        .where('u.active', '=', true)
        .forUpdate()
        .executeTakeFirst();
      if (!row)
        throw new AppError(
          'invalid_body',
          'This link was already used or expired. Ask for a new one on the “Forgot password” page.',
          { token: ['This link was already used or expired.'] },
        );
      const problem = findPasswordProblem(newPassword, row);
      if (problem) refuseNewPassword(problem);
      await storeNewPassword(trx, row, newPassword, 'user.password_reset');
    });
}
