import 'server-only';
import { getDb } from '@/lib/db';
import { updateDraftGrammar as writeDraftGrammar } from '@/lib/db/vocabulary';
import { AppError } from '@/lib/errors';
import type { Grammar } from '@/lib/schemas/grammar';
import { getDraftVersionOrThrow, getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';
import { recordAudit } from '../platform/record-audit';

const countPhrases = (g: Grammar) =>
  g.vocabulary.components.reduce((n, c) => n + c.phrases.length, 0) +
  g.vocabulary.conditions.reduce((n, c) => n + c.phrases.length, 0);

/** Save the trainer's edits to the draft: the whole grammar document, already checked for dangling ids. */
export async function updateDraftGrammar({
  fleetId,
  actorId,
  id,
  grammar,
  label,
  baseUpdatedAt,
}: {
  fleetId: string;
  actorId: string;
  id: string;
  grammar: Grammar;
  label?: string;
  baseUpdatedAt?: string;
}) {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      await trx.selectFrom('vocabularyVersion').select('id').where('id', '=', id).forUpdate().execute();
      const before = await getDraftVersionOrThrow(trx, { fleetId, id });
      if (baseUpdatedAt && new Date(baseUpdatedAt).getTime() !== new Date(before.updatedAt).getTime()) {
        throw new AppError(
          'conflict',
          'The draft was saved by someone else after you opened it. Reload the editor to see their changes, then make yours again.',
        );
      }
      if (label && label !== before.label) {
        const taken = await trx
          .selectFrom('vocabularyVersion')
          .select('id')
          .where('fleetId', '=', fleetId)
          .where('label', '=', label)
          .executeTakeFirst();
        if (taken)
          throw new AppError('conflict', `The label “${label}” is already used in this fleet.`, {
            label: ['already used'],
          });
      }
      const saved = await writeDraftGrammar(trx, { fleetId, id, grammar, label });
      if (!saved) throw new AppError('conflict', 'This version was published meanwhile and cannot change.');
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'vocabulary.draft_saved',
        entity: 'vocabulary_version',
        entityId: id,
        detail: {
          components: grammar.vocabulary.components.length,
          conditions: grammar.vocabulary.conditions.length,
          phrases: countPhrases(grammar),
          phrasesBefore: countPhrases(before.grammar),
        },
      });
      return getVocabularyVersionOrThrow(trx, { fleetId, id });
    });
}
