import 'server-only';
import { sql } from 'kysely';
import type { DB } from '@/lib/db';
import { getDefaultGrammar, toFullGrammar } from '@/lib/db/vocabulary';
import type { Grammar, Vocabulary } from '@/lib/schemas/grammar';

const cache = new Map<string, Grammar>();

/** The whole grammar an inspection was started with (published versions never change, so they are cached). */
export async function loadGrammar(db: DB, versionId: string | null): Promise<Grammar> {
  if (!versionId) return getDefaultGrammar();
  const hit = cache.get(versionId);
  if (hit) return hit;
  const row = await db
    .selectFrom('vocabularyVersion')
    .select(['status', sql<string>`grammar::text`.as('grammarText')])
    .where('id', '=', versionId)
    .executeTakeFirst();
  let grammar: Grammar;
  try {
    grammar = row ? toFullGrammar(JSON.parse(row.grammarText)) : getDefaultGrammar();
  } catch {
    grammar = getDefaultGrammar();
  }
  if (row?.status === 'published') cache.set(versionId, grammar);
  return grammar;
}

/** The vocabulary part of an inspection's grammar. */
export async function loadVocabulary(db: DB, versionId: string | null): Promise<Vocabulary> {
  return (await loadGrammar(db, versionId)).vocabulary;
}

// Term → words and severity is the walk core's (lib/walk), the same call on the phone and here.
export { resolveTerm, type ResolvedTerm } from '@/lib/walk';
