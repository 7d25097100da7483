import 'server-only';
import { getDb } from '@/lib/db';
import { getEnv } from '@/lib/env';
import { sendMail } from '@/lib/mail';
import type { RenderedMail } from '@/lib/mail/templates';

export type UnitMailKind = 'out_of_service' | 'back_in_service' | 'repair_needed';

/** The public address of the app, for links in mail. */
export function appUrl(path: string): string {
  const base = (getEnv().NEXTAUTH_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
  return `${base}${path}`;
}

/**
 * Send one unit-status mail to the fleet's maintenance and supervisor addresses and keep a copy
 * in mail_outbox (sent or failed). A failed send never undoes the certification that caused it.
 */
export async function sendUnitStatusMail({
  fleetId,
  kind,
  mail,
  extraTo = [],
}: {
  fleetId: string;
  kind: UnitMailKind;
  mail: RenderedMail;
  extraTo?: string[];
}) {
  const db = getDb();
  const fleet = await db
    .selectFrom('fleet')
    .select(['maintenanceEmail', 'supervisorEmail'])
    .where('id', '=', fleetId)
    .executeTakeFirst();
  const to = [
    ...new Set([fleet?.maintenanceEmail, fleet?.supervisorEmail, ...extraTo].filter((x): x is string => !!x)),
  ];
  if (!to.length) return { sent: false as const, reason: 'no maintenance or supervisor address in the fleet settings' };
  const row = await db
    .insertInto('mailOutbox')
    .values({
      fleetId,
      kind,
      toAddresses: to,
      subject: mail.subject,
      textBody: mail.text,
      htmlBody: mail.html,
      attempts: 1,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  try {
    await sendMail({ fleetId, to, subject: mail.subject, text: mail.text, html: mail.html });
    await db.updateTable('mailOutbox').set({ status: 'sent', sentAt: new Date() }).where('id', '=', row.id).execute();
    return { sent: true as const, to };
  } catch (err) {
    console.error('[rigcall] mail failed', kind, err);
    await db
      .updateTable('mailOutbox')
      .set({ status: 'failed', lastError: String(err).slice(0, 500) })
      .where('id', '=', row.id)
      .execute();
    return { sent: false as const, reason: 'the mail server did not take the message; it is kept in the outbox' };
  }
}
