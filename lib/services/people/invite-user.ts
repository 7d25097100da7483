import 'server-only';
import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { Role } from '@/lib/auth/roles';
import { roleLabel } from '@/lib/auth/roles';
import { getDb } from '@/lib/db';
import { findFleet } from '@/lib/db/fleets';
import { insertFleetUser } from '@/lib/db/users';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { sendMail } from '@/lib/mail';
import type { Role as InvitedRole } from '@/lib/schemas/users';
import { isUniqueViolation, recordAdminAudit } from '../platform/record-admin-audit';

// No 0/o, 1/l/i: a temporary password is read off a phone and typed with a thumb.
const alphabet = 'abcdefghjkmnpqrstuvwxyz23456789';

/** A random temporary password, e.g. "k7dm-x2qa-9frw" (about 59 bits). */
export function generateTemporaryPassword(groups = 3, size = 4): string {
  const out: string[] = [];
  const need = groups * size;
  while (out.length < need) {
    for (const b of randomBytes(need * 2)) {
      // Reject bytes past the last whole multiple of the alphabet, so every character is equally likely.
      if (b >= Math.floor(256 / alphabet.length) * alphabet.length) continue;
      out.push(alphabet[b % alphabet.length]!);
      if (out.length === need) break;
    }
  }
  return Array.from({ length: groups }, (_, g) => out.slice(g * size, g * size + size).join('')).join('-');
}

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function composeInviteMail(m: {
  name: string;
  email: string;
  fleetName: string;
  inviterName: string;
  roles: Role[];
  password: string;
  signInUrl: string;
}) {
  const roleWords = m.roles.map((r) => roleLabel[r].toLowerCase()).join(', ');
  const subject = `Your RigCall account for ${m.fleetName}`;
  const text = [
    `Hello ${m.name},`,
    '',
    `${m.inviterName} has set up a RigCall account for you at ${m.fleetName} (${roleWords}).`,
    '',
    `Sign in at:          ${m.signInUrl}`,
    `E-mail:              ${m.email}`,
    `Temporary password:  ${m.password}`,
    '',
    `The password is temporary: you will be asked to replace it with one of your own. It stops working after ${invitationLifetimeHours} hours.`,
    'Keep it to yourself. If this message was not meant for you, tell your fleet office.',
  ].join('\n');
  const html = `<div style="font-family:system-ui,sans-serif;font-size:16px;line-height:1.5">
<p>Hello ${escapeHtml(m.name)},</p>
<p>${escapeHtml(m.inviterName)} has set up a RigCall account for you at <b>${escapeHtml(m.fleetName)}</b> (${escapeHtml(roleWords)}).</p>
<table style="border-collapse:collapse">
<tr><td style="padding:4px 12px 4px 0">Sign in at</td><td><a href="${escapeHtml(m.signInUrl)}">${escapeHtml(m.signInUrl)}</a></td></tr>
<tr><td style="padding:4px 12px 4px 0">E-mail</td><td>${escapeHtml(m.email)}</td></tr>
<tr><td style="padding:4px 12px 4px 0">Temporary password</td><td><code style="font-size:20px;letter-spacing:1px">${escapeHtml(m.password)}</code></td></tr>
</table>
<p>The password is temporary: you will be asked to replace it with one of your own. It stops working after ${invitationLifetimeHours} hours.<br>Keep it to yourself. If this message was not meant for you, tell your fleet office.</p>
</div>`;
  return { subject, text, html };
}

/** How long an invitation's temporary password signs in (then the admin invites again). */
export const invitationLifetimeHours = 72;

/** What the admin is told after inviting: the same for every address outside their own fleet. */
export type SentInvitation = { email: string; name: string; roles: InvitedRole[] };

async function findEmailHolder(trx: Parameters<typeof findFleet>[0], { email }: { email: string }) {
  return trx.selectFrom('appUser').select(['id', 'fleetId', 'name']).where('email', '=', email).executeTakeFirst();
}

/** Tell a person with an account that someone tried to set up a second one for their address. */
async function sendExistingAccountNotice(m: { fleetId: string; email: string; name: string }) {
  const base = (getEnv().NEXTAUTH_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
  const text = [
    `Hello ${m.name},`,
    '',
    'Someone asked RigCall to set up an account for this e-mail address, which already has one.',
    'Nothing was changed: your account and password stay as they are.',
    '',
    `Sign in as usual at ${base}/sign-in. If you did not expect this, tell your fleet office.`,
  ].join('\n');
  try {
    await sendMail({ fleetId: m.fleetId, to: [m.email], subject: 'RigCall: your address was invited again', text });
  } catch (err) {
    // Same as a failed invitation, so the answer does not differ either.
    console.error('[rigcall] invitation notice failed', err);
    throw new AppError(
      'internal',
      'The invitation e-mail could not be sent, so no account was created. Try again in a moment.',
    );
  }
}

/**
 * Create an account with a random temporary password and e-mail the password to the person.
 * The mail goes out before the transaction commits: if it cannot be sent, no account is left
 * behind with a password nobody knows.
 */
export async function inviteUser(opts: {
  fleetId: string;
  actorId: string;
  name: string;
  email: string;
  roles: Role[];
}): Promise<{ invitation: SentInvitation }> {
  const email = opts.email.toLowerCase();
  const password = generateTemporaryPassword();
  const passwordHash = await bcrypt.hash(password, 10);
  const invitation: SentInvitation = { email, name: opts.name, roles: opts.roles };
  try {
    return await getDb()
      .transaction()
      .execute(async (trx) => {
        const holder = await findEmailHolder(trx, { email });
        if (holder && holder.fleetId === opts.fleetId)
          throw new AppError('conflict', `${email} already has an account.`, {
            email: [`${email} already has an account.`],
          });
        if (holder) {
          // An account in another fleet: the answer is the same as for a fresh invitation, so an
          // admin cannot probe other fleets' people. The person hears of it; nothing is created.
          await sendExistingAccountNotice({ fleetId: holder.fleetId, email, name: holder.name });
          return { invitation };
        }
        const fleet = await findFleet(trx, { fleetId: opts.fleetId });
        if (!fleet) throw new AppError('not_found', 'This fleet no longer exists.');
        const inviter = await trx
          .selectFrom('appUser')
          .select('name')
          .where('id', '=', opts.actorId)
          .where('fleetId', '=', opts.fleetId)
          .executeTakeFirst();
        const user = await insertFleetUser(trx, {
          fleetId: opts.fleetId,
          name: opts.name,
          email,
          roles: opts.roles,
          passwordHash,
          mustChangePassword: true,
          temporaryPasswordExpiresAt: new Date(Date.now() + invitationLifetimeHours * 3600_000),
        });
        await recordAdminAudit(trx, {
          fleetId: opts.fleetId,
          actorId: opts.actorId,
          action: 'user.invited',
          entity: 'app_user',
          entityId: user.id,
          detail: { email, name: opts.name, roles: opts.roles },
        });
        const base = (getEnv().NEXTAUTH_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
        const mail = composeInviteMail({
          name: opts.name,
          email,
          fleetName: fleet.name,
          inviterName: inviter?.name ?? 'Your fleet admin',
          roles: opts.roles,
          password,
          signInUrl: `${base}/sign-in`,
        });
        try {
          await sendMail({ fleetId: opts.fleetId, to: [email], ...mail });
        } catch (err) {
          console.error('[rigcall] invitation mail failed', err);
          throw new AppError(
            'internal',
            'The invitation e-mail could not be sent, so no account was created. Try again in a moment.',
          );
        }
        return { invitation };
      });
  } catch (err) {
    if (isUniqueViolation(err))
      throw new AppError('conflict', `${email} already has an account.`, {
        email: [`${email} already has an account.`],
      });
    throw err;
  }
}
