import 'server-only';
import type { ZodType } from 'zod';
import { fieldsFromZod } from '@/lib/api/parse-input';
import { getDb } from '@/lib/db';
import { findDraftVersionId, updateDraftGrammar as writeDraftGrammar } from '@/lib/db/vocabulary';
import { AppError } from '@/lib/errors';
import {
  commandsSchema,
  numbersSchema,
  positionsSchema,
  vocabularySchema,
  zonesSchema,
  type Grammar,
} from '@/lib/schemas/grammar';
import { listGrammarProblems, type ImportGrammarBody } from '@/lib/schemas/vocabulary';
import { createDraftVersion } from './create-draft-version';
import { getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';
import { recordAudit } from '../platform/record-audit';

const schemas: Record<keyof Grammar, ZodType> = {
  vocabulary: vocabularySchema,
  commands: commandsSchema,
  positions: positionsSchema,
  numbers: numbersSchema,
  zones: zonesSchema,
};

/**
 * Load grammars/ files into the fleet's draft (opened from the newest published version when
 * there is none). Each file is checked against its schema, then the whole for dangling ids.
 */
export async function importGrammar({
  fleetId,
  actorId,
  body,
}: {
  fleetId: string;
  actorId: string;
  body: ImportGrammarBody;
}) {
  const parts: Partial<Grammar> = {};
  const fields: Record<string, string[]> = {};
  for (const key of Object.keys(schemas) as (keyof Grammar)[]) {
    if (body.files[key] === undefined) continue;
    const r = schemas[key].safeParse(body.files[key]);
    if (r.success) (parts as Record<string, unknown>)[key] = r.data;
    else for (const [f, m] of Object.entries(fieldsFromZod(r.error))) fields[`${key}.json: ${f}`] = m;
  }
  if (Object.keys(fields).length) {
    const [first, msgs] = Object.entries(fields)[0]!;
    throw new AppError('invalid_body', `The file does not fit the grammar format (${first}: ${msgs[0]}).`, fields);
  }
  if (!Object.keys(parts).length)
    throw new AppError(
      'invalid_body',
      'Nothing to import: send at least one of vocabulary, commands, positions, numbers, zones.',
      { files: ['empty'] },
    );
  const draftId =
    (await findDraftVersionId(getDb(), { fleetId })) ??
    (await createDraftVersion({ fleetId, actorId, body: {} })).version.id;
  return getDb()
    .transaction()
    .execute(async (trx) => {
      const draft = await getVocabularyVersionOrThrow(trx, { fleetId, id: draftId });
      const grammar: Grammar = { ...draft.grammar, ...parts };
      const problems = listGrammarProblems(grammar);
      if (problems.length)
        throw new AppError(
          'invalid_body',
          `The imported grammar does not hold together: ${problems[0]}${problems.length > 1 ? ` (and ${problems.length - 1} more)` : ''}.`,
          { grammar: problems },
        );
      const saved = await writeDraftGrammar(trx, { fleetId, id: draftId, grammar });
      if (!saved) throw new AppError('conflict', 'The draft was published meanwhile; try the import again.');
      await recordAudit(trx, {
        fleetId,
        actorId,
        action: 'vocabulary.imported',
        entity: 'vocabulary_version',
        entityId: draftId,
        detail: { files: Object.keys(parts) },
      });
      return { version: await getVocabularyVersionOrThrow(trx, { fleetId, id: draftId }), files: Object.keys(parts) };
    });
}
