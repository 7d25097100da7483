import 'server-only';
import { getDb } from '@/lib/db';
import { findDraftVersionId, findNewestPublishedId, getDefaultGrammar } from '@/lib/db/vocabulary';
import { createNormalizer, createQuantityReader } from '@/lib/matcher';
import type { BenchBody, BenchResult } from '@/lib/schemas/vocabulary';
import { describeMatch } from './describe-match';
import { getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';
import { getVersionMatcher } from './version-matcher';

/** One utterance through the draft and the published version: the normalised words, the numbers read, the ranked matches. */
export async function runTestBench({ fleetId, body }: { fleetId: string; body: BenchBody }): Promise<BenchResult> {
  const db = getDb();
  const [draftId, publishedId] = await Promise.all([
    findDraftVersionId(db, { fleetId }),
    findNewestPublishedId(db, { fleetId }),
  ]);
  const [draft, published] = await Promise.all([
    draftId ? getVocabularyVersionOrThrow(db, { fleetId, id: draftId }) : null,
    publishedId ? getVocabularyVersionOrThrow(db, { fleetId, id: publishedId }) : null,
  ]);
  const grammar = draft?.grammar ?? published?.grammar ?? getDefaultGrammar();
  const tokens = createNormalizer(grammar.commands)(body.text);
  const numbers = createQuantityReader(grammar.numbers)(tokens).map((q) => ({
    value: q.value,
    unit: q.unit,
    words: tokens.slice(q.start, q.end).join(' '),
  }));
  const ctx = { zone: body.zone ?? null };
  const run = (v: NonNullable<typeof draft>) => ({
    versionId: v.id,
    label: v.label,
    match: describeMatch(getVersionMatcher(v).match(body.text, ctx)),
  });
  return {
    text: body.text,
    normalized: tokens.join(' '),
    numbers,
    draft: draft ? run(draft) : null,
    published: published ? run(published) : null,
  };
}
