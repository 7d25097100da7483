import 'server-only';
import { getDb } from '@/lib/db';
import { findReportForReview, updateReportReview } from '@/lib/db/reports';
import { AppError } from '@/lib/errors';

/** The supervisor marks a submitted report reviewed, with an optional note; recorded in the audit log. */
export async function reviewReport({
  fleetId,
  actorId,
  id,
  note,
}: {
  fleetId: string;
  actorId: string;
  id: string;
  note: string;
}) {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const report = await findReportForReview(trx, { fleetId, id });
      if (!report) throw new AppError('not_found', 'No such inspection report in your fleet.');
      if (report.status !== 'submitted')
        throw new AppError('conflict', 'This report is still being walked; review it once the driver has signed it.');
      const updated = await updateReportReview(trx, {
        fleetId,
        id,
        reviewedBy: actorId,
        note: note || null,
        at: new Date(),
      });
      await trx
        .insertInto('auditLog')
        .values({
          fleetId,
          actorId,
          action: report.reviewedAt ? 'report.review_updated' : 'report.reviewed',
          entity: 'inspection',
          entityId: id,
          detail: JSON.stringify({ note: note || null }),
        })
        .execute();
      return { id: updated.id, reviewedAt: updated.reviewedAt!.toISOString(), reviewNote: updated.reviewNote };
    });
}
