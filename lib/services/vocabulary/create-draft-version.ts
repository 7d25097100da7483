import 'server-only';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import {
  countVocabularyVersions,
  findDraftVersionId,
  findNewestPublishedId,
  getDefaultGrammar,
} from '@/lib/db/vocabulary';
import type { CreateVersionBody } from '@/lib/schemas/vocabulary';
import { getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';
import { recordAudit } from '../platform/record-audit';

/**
 * Open the fleet's draft: a copy of the chosen version, else of the newest published one, else
 * of the default grammar files. A fleet has one draft at a time; asking again returns it.
 */
export async function createDraftVersion({
  fleetId,
  actorId,
  body,
}: {
  fleetId: string;
  actorId: string;
  body: CreateVersionBody;
}) {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      await trx.selectFrom('fleet').select('id').where('id', '=', fleetId).forUpdate().execute();
      const existing = await findDraftVersionId(trx, { fleetId });
      if (existing)
        return { version: await getVocabularyVersionOrThrow(trx, { fleetId, id: existing }), created: false };
      const baseId = body.basedOnId ?? (await findNewestPublishedId(trx, { fleetId }));
      const base = baseId ? await getVocabularyVersionOrThrow(trx, { fleetId, id: baseId }) : null;
      const n = (await countVocabularyVersions(trx, { fleetId })) + 1;
      let label = body.label ?? `Version ${n}`;
      const taken = await trx
        .selectFrom('vocabularyVersion')
        .select('id')
        .where('fleetId', '=', fleetId)
        .where('label', '=', label)
        .executeTakeFirst();
      if (taken) {
        if (body.label)
          throw new AppError('conflict', `The label “${label}” is already used in this fleet.`, {
            label: ['already used'],
          });
        label = `${label} (${new Date().toISOString().slice(0, 16).replace('T', ' ')})`;
      }
      const grammar = base?.grammar ?? getDefaultGrammar();
      const row = await trx
        .insertInto('vocabularyVersion')
        .values({ fleetId, label, status: 'draft', basedOnId: base?.id ?? null, grammar: JSON.stringify(grammar) })
        .returning('id')
        .executeTakeFirstOrThrow();
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'vocabulary.draft_created',
        entity: 'vocabulary_version',
        entityId: row.id,
        detail: { label, basedOn: base?.label ?? 'default files' },
      });
      return { version: await getVocabularyVersionOrThrow(trx, { fleetId, id: row.id }), created: true };
    });
}
