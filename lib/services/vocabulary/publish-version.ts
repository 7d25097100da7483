import 'server-only';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import type { PublishBody } from '@/lib/schemas/vocabulary';
import { evaluateVocabulary } from './evaluate-vocabulary';
import { getDraftVersionOrThrow, getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';
import { recordAudit } from '../platform/record-audit';

/**
 * Publish the draft: from now on new inspections use it, and the row can no longer change (a
 * trigger refuses). A draft scoring lower than the published version on the labelled set is
 * only published with an override and its reason, both kept in the audit log.
 */
export async function publishVersion({
  fleetId,
  actorId,
  id,
  body,
}: {
  fleetId: string;
  actorId: string;
  id: string;
  body: PublishBody;
}) {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      await trx.selectFrom('vocabularyVersion').select('id').where('id', '=', id).forUpdate().execute();
      await getDraftVersionOrThrow(trx, { fleetId, id });
      const report = await evaluateVocabulary({ fleetId, versionId: id, db: trx });
      if (report.lowersAccuracy && !body.override) {
        const p = report.published!.figures;
        throw new AppError(
          'conflict',
          `This draft scores lower than “${report.published!.label}” on the labelled set (top-1 ${report.figures.top1}/${report.figures.total} against ${p.top1}/${p.total}, top-3 ${report.figures.top3} against ${p.top3}). Publish it anyway only with a reason.`,
          { override: ['a reason is needed to publish a draft that lowers accuracy'] },
        );
      }
      await trx
        .updateTable('vocabularyVersion')
        .set({ status: 'published', publishedAt: new Date(), publishedBy: actorId })
        .where('id', '=', id)
        .where('status', '=', 'draft')
        .execute();
      const figures = {
        top1: report.figures.top1,
        top3: report.figures.top3,
        total: report.figures.total,
        set: report.set.name,
      };
      const before = report.published
        ? { label: report.published.label, top1: report.published.figures.top1, top3: report.published.figures.top3 }
        : null;
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: report.lowersAccuracy ? 'vocabulary.published_with_override' : 'vocabulary.published',
        entity: 'vocabulary_version',
        entityId: id,
        detail: {
          label: report.version.label,
          figures,
          replaces: before,
          ...(report.lowersAccuracy
            ? { overrideReason: body.override!.reason, newlyMissed: report.newlyMissed.map((l) => l.text) }
            : {}),
        },
      });
      return {
        version: await getVocabularyVersionOrThrow(trx, { fleetId, id }),
        evaluation: report,
        override: report.lowersAccuracy,
      };
    });
}
