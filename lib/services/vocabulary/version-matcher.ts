import 'server-only';
import { createMatcher, type Matcher } from '@/lib/matcher';
import type { Grammar } from '@/lib/schemas/grammar';

const cache = new Map<string, Matcher>();

/** A matcher over one version's grammar, kept while the version is unchanged (a draft's key moves with its updatedAt). */
export function getVersionMatcher(version: { id: string; updatedAt: string; grammar: Grammar }): Matcher {
  const key = `${version.id}@${version.updatedAt}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const matcher = createMatcher(version.grammar);
  if (cache.size >= 12) cache.delete(cache.keys().next().value!);
  cache.set(key, matcher);
  return matcher;
}
