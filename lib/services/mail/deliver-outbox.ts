import 'server-only';
import { sql } from 'kysely';
import { getDb } from '@/lib/db';
import { sendMail } from '@/lib/mail';

/**
 * Send the fleet's pending mail. Rows are claimed with SKIP LOCKED so two app instances never
 * send the same message; a failure is kept with its error and tried again on the next call.
 */
export async function deliverOutbox({
  fleetId,
  limit = 20,
}: {
  fleetId: string;
  limit?: number;
}): Promise<{ sent: number; failed: number }> {
  const db = getDb();
  let sent = 0;
  let failed = 0;
  for (let i = 0; i < limit; i++) {
    const done = await db.transaction().execute(async (trx) => {
      const row = await trx
        .selectFrom('mailOutbox')
        .select(['id', 'toAddresses', 'subject', 'textBody', 'htmlBody', 'attempts'])
        .where('fleetId', '=', fleetId)
        .where('status', 'in', ['pending', 'failed'])
        .where('attempts', '<', 5)
        .orderBy('createdAt')
        .limit(1)
        .forUpdate()
        .modifyEnd(sql`skip locked`)
        .executeTakeFirst();
      if (!row) return null;
      try {
        await sendMail({
          fleetId,
          to: row.toAddresses,
          subject: row.subject,
          text: row.textBody,
          html: row.htmlBody ?? undefined,
        });
        await trx
          .updateTable('mailOutbox')
          .set({ status: 'sent', sentAt: new Date(), attempts: row.attempts + 1, lastError: null })
          .where('id', '=', row.id)
          .execute();
        return 'sent' as const;
      } catch (err) {
        await trx
          .updateTable('mailOutbox')
          .set({ status: 'failed', attempts: row.attempts + 1, lastError: String(err).slice(0, 500) })
          .where('id', '=', row.id)
          .execute();
        return 'failed' as const;
      }
    });
    if (!done) break;
    if (done === 'sent') sent++;
    else failed++;
  }
  return { sent, failed };
}
