import 'server-only';
import { getDb, type DB } from '@/lib/db';
import { findNewestPublishedId, listCorrectedFieldUtterances } from '@/lib/db/vocabulary';
import type { Matcher, MatchResult } from '@/lib/matcher';
import {
  getLabelledContext,
  isTopOneCorrect,
  isTopThreeCorrect,
  parseLabelledJsonl,
  type LabelledUtterance,
} from '@/lib/matcher/fixture-scoring';
import type { EvaluationLine, EvaluationReport, Figures } from '@/lib/schemas/vocabulary';
import { getVocabularyVersionOrThrow } from './get-vocabulary-version-or-throw';
import { loadTestSet, readRepositorySet } from './load-test-set';
import { getVersionMatcher } from './version-matcher';

const expectedOf = (u: LabelledUtterance) =>
  u.termId ??
  (u.kind === 'measurement'
    ? `${u.measure} ${u.value} ${u.unit}`
    : u.kind === 'command' || u.kind === 'ok'
      ? `command:${u.command ?? 'ok'}`
      : u.kind);
const gotOf = (r: MatchResult) =>
  r.kind === 'measurement'
    ? `${r.measure} ${r.value} ${r.unit}`
    : r.kind === 'command' || r.kind === 'ok'
      ? `command:${r.command ?? 'ok'}`
      : (r.termId ?? r.kind);

const rate = (n: number, total: number) => (total ? Math.round((n / total) * 10000) / 10000 : 0);

/** Top-1 / top-3 over a labelled set with the same scoring as the matcher's fixture tests. */
export function scoreLabelledSet(matcher: Matcher, items: readonly LabelledUtterance[]) {
  const lines = items.map((u) => {
    const r = matcher.match(u.text, getLabelledContext(u));
    const top1 = isTopOneCorrect(u, r);
    const line: EvaluationLine = {
      text: u.text,
      zone: u.ctx?.zone ?? u.zone ?? null,
      expected: expectedOf(u),
      got: gotOf(r),
      score: r.score,
      top3: isTopThreeCorrect(u, r),
    };
    return { top1, line };
  });
  const top1 = lines.filter((l) => l.top1).length;
  const top3 = lines.filter((l) => l.line.top3).length;
  const figures: Figures = {
    total: items.length,
    top1,
    top3,
    top1Rate: rate(top1, items.length),
    top3Rate: rate(top3, items.length),
  };
  return { figures, lines };
}

/** How long scoring may hold the thread before it lets other requests run. */
const sliceMs = 10;
const yieldToOthers = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * scoreLabelledSet, in slices of about 10 ms with a yield between them, so that a large set does
 * not hold the request thread (other users' requests are answered between slices).
 */
export async function scoreLabelledSetInSlices(matcher: Matcher, items: readonly LabelledUtterance[]) {
  const parts: ReturnType<typeof scoreLabelledSet>['lines'] = [];
  let next = 0;
  while (next < items.length) {
    const began = performance.now();
    do {
      parts.push(...scoreLabelledSet(matcher, items.slice(next, next + 1)).lines);
      next++;
    } while (next < items.length && performance.now() - began < sliceMs);
    if (next < items.length) await yieldToOthers();
  }
  const top1 = parts.filter((l) => l.top1).length;
  const top3 = parts.filter((l) => l.line.top3).length;
  const figures: Figures = {
    total: items.length,
    top1,
    top3,
    top1Rate: rate(top1, items.length),
    top3Rate: rate(top3, items.length),
  };
  return { figures, lines: parts };
}

/** A version on the fleet's labelled set, beside the newest published version. */
export async function evaluateVocabulary({
  fleetId,
  versionId,
  db = getDb(),
}: {
  fleetId: string;
  versionId: string;
  db?: DB;
}): Promise<EvaluationReport> {
  const [version, set, publishedId, corrected] = await Promise.all([
    getVocabularyVersionOrThrow(db, { fleetId, id: versionId }),
    loadTestSet(db, { fleetId }),
    findNewestPublishedId(db, { fleetId }),
    listCorrectedFieldUtterances(db, { fleetId, limit: 2000 }),
  ]);
  const matcher = getVersionMatcher(version);
  const mine = await scoreLabelledSetInSlices(matcher, set.items);
  // the same draft on a set written apart from any tuning and on what drivers corrected in the field
  const heldOut = parseLabelledJsonl(readRepositorySet('held-out-spoken.jsonl'));
  const field: LabelledUtterance[] = corrected.map((c) => ({
    text: c.text,
    zone: c.zone ?? undefined,
    kind: 'defect',
    termId: c.termKey ?? undefined,
  }));
  const otherSets = [];
  for (const { name, items } of [
    { name: 'spoken held-out set (held-out-spoken.jsonl)', items: heldOut },
    { name: `field-labelled set (${field.length} corrected field utterances)`, items: field },
  ]) {
    const scored = await scoreLabelledSetInSlices(matcher, items);
    otherSets.push({ name, figures: scored.figures, misses: scored.lines.filter((l) => !l.top1).map((l) => l.line) });
  }
  const published =
    publishedId && publishedId !== version.id
      ? await getVocabularyVersionOrThrow(db, { fleetId, id: publishedId })
      : null;
  const theirs = published ? await scoreLabelledSetInSlices(getVersionMatcher(published), set.items) : null;
  const newlyMissed: EvaluationLine[] = [];
  const newlyFixed: EvaluationLine[] = [];
  if (theirs) {
    mine.lines.forEach((l, i) => {
      const p = theirs.lines[i]!;
      if (p.top1 && !l.top1) newlyMissed.push(l.line);
      if (!p.top1 && l.top1) newlyFixed.push(l.line);
    });
  }
  return {
    set: { name: set.name, count: set.items.length, source: set.source },
    version: { id: version.id, label: version.label, status: version.status },
    figures: mine.figures,
    misses: mine.lines.filter((l) => !l.top1).map((l) => l.line),
    published: published && theirs ? { id: published.id, label: published.label, figures: theirs.figures } : null,
    newlyMissed,
    newlyFixed,
    lowersAccuracy: !!theirs && (mine.figures.top1 < theirs.figures.top1 || mine.figures.top3 < theirs.figures.top3),
    otherSets,
  };
}
