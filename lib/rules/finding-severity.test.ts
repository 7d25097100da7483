import { describe, expect, it } from 'vitest';
import { caNsc13Profile, getFindingSeverity, listUnclassifiedPairs } from './index';
import type { VocabularyPair } from './index';

const pairs: VocabularyPair[] = [
  // NSC 13 Schedule 1 Part 21: tire touching another tire = major (MTO truck handbook).
  {
    componentId: 'dual-tires',
    conditionId: 'touching',
    severity: { us: 'major', ca: 'major' },
    source: 'NSC 13 Schedule 1 Part 21; 49 CFR 393.75',
  },
  // NSC 13 Schedule 1 Part 1: audible air leak = minor.
  {
    componentId: 'air-line',
    conditionId: 'audible-leak',
    severity: { ca: 'minor' },
    source: 'NSC 13 Schedule 1 Part 1',
  },
  { componentId: 'mud-flap', conditionId: 'missing' },
];

describe('finding severity', () => {
  it('returns the mapped severity for the profile', () => {
    expect(getFindingSeverity(pairs[0]!, 'us')).toEqual({
      severity: 'major',
      unclassified: false,
      source: 'NSC 13 Schedule 1 Part 21; 49 CFR 393.75',
    });
    expect(getFindingSeverity(pairs[1]!, 'ca-nsc13')).toMatchObject({ severity: 'minor', unclassified: false });
    expect(getFindingSeverity(pairs[1]!, caNsc13Profile)).toMatchObject({ severity: 'minor' });
  });
  it('defaults to major, flagged unclassified, when no mapping exists (safe side)', () => {
    expect(getFindingSeverity(pairs[1]!, 'us')).toMatchObject({ severity: 'major', unclassified: true });
    expect(getFindingSeverity(pairs[2]!)).toMatchObject({ severity: 'major', unclassified: true });
    expect(getFindingSeverity(pairs[0]!, 'mars')).toMatchObject({ severity: 'major', unclassified: true });
  });
  it('lists unclassified pairs for trainers', () => {
    expect(listUnclassifiedPairs(pairs, 'us').map((p) => p.componentId)).toEqual(['air-line', 'mud-flap']);
    expect(listUnclassifiedPairs(pairs, 'ca').map((p) => p.componentId)).toEqual(['mud-flap']);
    const all = listUnclassifiedPairs(pairs);
    expect(all.map((p) => [p.componentId, p.missing])).toEqual([
      ['air-line', ['us']],
      ['mud-flap', ['us', 'ca']],
    ]);
  });
});
