import 'server-only';
import { sql } from 'kysely';
import defaultVocabulary from '@/grammars/vocabulary.json' with { type: 'json' };
import type { DB } from '@/lib/db';
import { getFindingSeverity } from '@/lib/rules';
import { vocabularySchema, type Vocabulary } from '@/lib/schemas/grammar';

const cache = new Map<string, Vocabulary>();
const fallback = vocabularySchema.parse(defaultVocabulary);

/** The vocabulary an inspection was started with (published versions never change, so they are cached). */
export async function loadVocabulary(db: DB, versionId: string | null): Promise<Vocabulary> {
  if (!versionId) return fallback;
  const hit = cache.get(versionId);
  if (hit) return hit;
  const row = await db.selectFrom('vocabularyVersion').select(['status', sql<string>`grammar::text`.as('grammarText')]).where('id', '=', versionId).executeTakeFirst();
  const raw = row ? (JSON.parse(row.grammarText) as { vocabulary?: unknown } | null) : null;
  const parsed = vocabularySchema.safeParse(raw && typeof raw === 'object' && 'vocabulary' in raw ? raw.vocabulary : raw);
  const vocab = parsed.success ? parsed.data : fallback;
  if (row?.status === 'published') cache.set(versionId, vocab);
  return vocab;
}

export type ResolvedTerm = { componentId: string; component: string; condition: string; severity: 'minor' | 'major'; source: string | null };

/** A component:condition key → its plain words and its severity under the rule profile; null if unknown. */
export function resolveTerm(vocab: Vocabulary, termKey: string, profile: string): ResolvedTerm | null {
  const [componentId, conditionId] = termKey.split(':');
  const component = vocab.components.find((c) => c.id === componentId);
  const condition = vocab.conditions.find((c) => c.id === conditionId);
  if (!component || !condition) return null;
  const pair = component.defects.find((d) => d.condition === condition.id);
  const sev = getFindingSeverity({ componentId: component.id, conditionId: condition.id, severity: pair?.severity, source: pair?.source }, profile);
  return { componentId: component.id, component: component.name, condition: condition.name, severity: sev.severity, source: sev.source };
}
