import type { MatchContext, MatchResult } from './types';

/** One labelled utterance from tests/fixtures/matcher/*.jsonl. */
export type LabelledUtterance = {
  text: string;
  zone?: string;
  ctx?: MatchContext;
  kind: MatchResult['kind'];
  termId?: string;
  command?: string;
  measure?: string;
  value?: number;
  unit?: string;
  component?: string;
  position?: string;
};

/** Parse a JSONL fixture text into labelled utterances (blank lines skipped). */
export function parseLabelledJsonl(text: string): LabelledUtterance[] {
  return text
    .split('\n')
    .filter((l) => l.trim() !== '')
    .map((l) => JSON.parse(l) as LabelledUtterance);
}

/** Context a labelled utterance is matched in. */
export function getLabelledContext(u: LabelledUtterance): MatchContext {
  return u.ctx ?? { zone: u.zone ?? null };
}

/** Top-1 correctness: same kind and the same term, command or measured value. */
export function isTopOneCorrect(u: LabelledUtterance, r: MatchResult): boolean {
  if (r.kind !== u.kind) return false;
  if (u.kind === 'defect') return r.termId === u.termId;
  if (u.kind === 'command' || u.kind === 'ok') return r.command === (u.command ?? 'ok');
  if (u.kind === 'measurement')
    return (
      r.measure === u.measure && r.unit === u.unit && r.value !== null && Math.abs(r.value - (u.value ?? NaN)) < 1e-6
    );
  return true;
}

/** Top-3 correctness for findings: the labelled term is the reading or one of the first two alternatives. */
export function isTopThreeCorrect(u: LabelledUtterance, r: MatchResult): boolean {
  if (isTopOneCorrect(u, r)) return true;
  if (u.kind !== 'defect') return false;
  return r.alternatives.slice(0, 2).some((a) => a.termId === u.termId);
}
