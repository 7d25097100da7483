import 'server-only';
import { sql } from 'kysely';
import type { DB } from '@/lib/db';
import { getDefaultGrammar, toFullGrammar } from '@/lib/db/vocabulary';
import { getFindingSeverity } from '@/lib/rules';
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

export type ResolvedTerm = {
  componentId: string;
  component: string;
  condition: string;
  severity: 'minor' | 'major';
  source: string | null;
};

/** A component:condition key → its plain words and its severity under the rule profile; null if unknown. */
export function resolveTerm(vocab: Vocabulary, termKey: string, profile: string): ResolvedTerm | null {
  const [componentId, conditionId] = termKey.split(':');
  const component = vocab.components.find((c) => c.id === componentId);
  const condition = vocab.conditions.find((c) => c.id === conditionId);
  if (!component || !condition) return null;
  const pair = component.defects.find((d) => d.condition === condition.id);
  const sev = getFindingSeverity(
    { componentId: component.id, conditionId: condition.id, severity: pair?.severity, source: pair?.source },
    profile,
  );
  return {
    componentId: component.id,
    component: component.name,
    condition: condition.name,
    severity: sev.severity,
    source: sev.source,
  };
}
