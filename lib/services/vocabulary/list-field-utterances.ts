import 'server-only';
import { getDb } from '@/lib/db';
import { findDraftVersionId, findNewestPublishedId, listOpenFieldUtterances } from '@/lib/db/vocabulary';
import { createNormalizer } from '@/lib/matcher';
import type { FieldUtteranceGroup } from '@/lib/schemas/vocabulary';
import { describeMatch } from './describe-match';
import { getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';
import { getVersionMatcher } from './version-matcher';

const glue = new Set([
  'the',
  'a',
  'an',
  'is',
  'on',
  'of',
  'my',
  'it',
  'its',
  'there',
  'theres',
  's',
  'got',
  'has',
  'this',
  'that',
  'and',
]);

function stem(w: string) {
  return w.length > 3 && w.endsWith('s') && !w.endsWith('ss') ? w.slice(0, -1) : w;
}

function jaccard(a: Set<string>, b: Set<string>) {
  let both = 0;
  for (const x of a) if (b.has(x)) both += 1;
  return both / (a.size + b.size - both || 1);
}

/**
 * Open field utterances grouped by similar text: the same words after normalising (fillers,
 * glue words and plurals aside) form one group, and groups sharing most of their words merge.
 */
export async function listFieldUtterances({ fleetId, limit = 2000 }: { fleetId: string; limit?: number }) {
  const db = getDb();
  const [rows, draftId, publishedId] = await Promise.all([
    listOpenFieldUtterances(db, { fleetId, limit }),
    findDraftVersionId(db, { fleetId }),
    findNewestPublishedId(db, { fleetId }),
  ]);
  const versionId = draftId ?? publishedId;
  const version = versionId ? await getVocabularyVersionOrThrow(db, { fleetId, id: versionId }) : null;
  const grammar = version?.grammar;
  const normalize = grammar ? createNormalizer(grammar.commands) : (t: string) => t.toLowerCase().split(/\s+/);
  const fillers = new Set([...glue, ...(grammar?.commands.fillers ?? [])]);
  type Acc = { words: Set<string>; rows: typeof rows };
  const groups: Acc[] = [];
  for (const row of rows) {
    const words = new Set(
      normalize(row.text)
        .filter((w) => !fillers.has(w))
        .map(stem),
    );
    const home = groups.find((g) => jaccard(g.words, words) >= 0.75);
    if (home) home.rows.push(row);
    else groups.push({ words, rows: [row] });
  }
  const matcher = version ? getVersionMatcher(version) : null;
  const out: FieldUtteranceGroup[] = groups.map((g) => {
    const variants = new Map<string, number>();
    const outcomes: Record<string, number> = {};
    for (const r of g.rows) {
      const t = r.text.trim().toLowerCase();
      variants.set(t, (variants.get(t) ?? 0) + 1);
      outcomes[r.outcome] = (outcomes[r.outcome] ?? 0) + 1;
    }
    const ordered = [...variants.entries()].sort((a, b) => b[1] - a[1]).map(([text, count]) => ({ text, count }));
    const text = ordered[0]!.text;
    const corrected = g.rows.find(
      (r) =>
        r.termKey && r.termKey.includes(':') && !r.termKey.startsWith('command:') && !r.termKey.startsWith('measure:'),
    );
    const zone = g.rows[0]!.zone;
    let suggestion: FieldUtteranceGroup['suggestion'] = null;
    if (corrected?.termKey && grammar) {
      const [c, d] = corrected.termKey.split(':');
      const comp = grammar.vocabulary.components.find((x) => x.id === c);
      const cond = grammar.vocabulary.conditions.find((x) => x.id === d);
      if (comp && cond) suggestion = { termKey: corrected.termKey, label: `${comp.name}, ${cond.name}` };
    }
    if (!suggestion && matcher) {
      const m = describeMatch(matcher.match(text, { zone }));
      const first =
        m.kind === 'defect' && m.termId
          ? { termKey: m.termId, label: m.label }
          : m.alternatives[0]
            ? { termKey: m.alternatives[0].termId, label: m.alternatives[0].label }
            : null;
      suggestion = first && first.termKey.includes(':') && !first.termKey.startsWith('command:') ? first : null;
    }
    return {
      key: g.rows.map((r) => r.id).sort()[0]!,
      text,
      count: g.rows.length,
      ids: g.rows.map((r) => r.id),
      variants: ordered,
      outcomes,
      zones: [...new Set(g.rows.map((r) => r.zone).filter((z): z is string => !!z))],
      lastSeen: g.rows.reduce((m, r) => (r.createdAt > m ? r.createdAt : m), g.rows[0]!.createdAt).toISOString(),
      suggestion,
    };
  });
  out.sort((a, b) => b.count - a.count || b.lastSeen.localeCompare(a.lastSeen));
  return { groups: out, total: rows.length, versionId: version?.id ?? null };
}
