import { describe, expect, it } from 'vitest';
import {
  countWordEdits,
  getNbestConfidences,
  getNoiseGain,
  getSnrDb,
  getWordErrorRate,
  readArpa,
  toWords,
  writeArpa,
} from '@/scripts/bench-speech-math';

describe('word error rate', () => {
  // The textbook definition (substitutions + deletions + insertions) / reference words.
  it('counts one substitution, one deletion and one insertion', () => {
    expect(countWordEdits(toWords('steer tire bulge'), toWords('their tire bulge'))).toBe(1);
    expect(countWordEdits(toWords('left steer tire'), toWords('left tire'))).toBe(1);
    expect(countWordEdits(toWords('next'), toWords('the next'))).toBe(1);
  });
  it('sums edits over the corpus and divides by the reference words', () => {
    const wer = getWordErrorRate([
      { reference: 'bulge on the left steer tire', hypothesis: 'doubled on the left their fire' },
      { reference: 'next', hypothesis: 'next' },
      { reference: 'all good', hypothesis: '' },
    ]);
    // 3 edits in sentence 1, 0, 2 deletions: 5 over 6 + 1 + 2 = 9 words
    expect(wer).toBeCloseTo(5 / 9, 10);
  });
  it('ignores case and punctuation but keeps apostrophes', () => {
    expect(toWords("Right steer's LOW, ok?")).toEqual(['right', "steer's", 'low', 'ok']);
    expect(getWordErrorRate([{ reference: 'Tire is LOW.', hypothesis: 'tire is low' }])).toBe(0);
  });
});

describe('noise gain for a signal-to-noise ratio', () => {
  it('gives a gain that puts the RMS ratio at the target', () => {
    const speech = 0.0888;
    const noise = 0.2;
    for (const snr of [15, 5, 0, -3]) {
      const g = getNoiseGain(speech, noise, snr);
      expect(getSnrDb(speech, noise * g)).toBeCloseTo(snr, 9);
    }
  });
  it('matches hand arithmetic: 20 dB is one tenth of the speech RMS', () => {
    expect(getNoiseGain(0.1, 0.5, 20)).toBeCloseTo(0.02, 12);
    expect(getSnrDb(1, 0.1)).toBeCloseTo(20, 12);
  });
  it('refuses a silent signal', () => {
    expect(() => getNoiseGain(0, 0.1, 15)).toThrow();
  });
});

describe('n-best confidences', () => {
  it('sum to one and keep the order of the scores', () => {
    const c = getNbestConfidences([-100, -102, -110], 0.5);
    expect(c.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    expect(c[0]).toBeGreaterThan(c[1] ?? 1);
    expect((c[0] ?? 0) / (c[1] ?? 1)).toBeCloseTo(Math.exp(1), 9);
  });
});

describe('ARPA writer', () => {
  const sentences = [
    ['left', 'steer', 'tire', 'flat'],
    ['steer', 'tire', 'bulge'],
    ['left', 'steer', 'tire', 'bulge'],
    ['next'],
  ];
  const arpa = writeArpa(sentences, 3);
  const { probs, bows } = readArpa(arpa);
  const vocab = ['left', 'steer', 'tire', 'flat', 'bulge', 'next', '</s>'];
  const p = (h: string[], w: string): number => {
    const key = [...h, w].join(' ');
    const direct = probs.get(key);
    if (direct !== undefined) return 10 ** direct;
    if (h.length === 0) return 0;
    return 10 ** (bows.get(h.join(' ')) ?? 0) * p(h.slice(1), w);
  };
  it('declares the counts it writes', () => {
    expect(arpa).toMatch(/ngram 1=8\n/); // 7 words + <s>
    expect(arpa).toContain('\\3-grams:');
    expect(probs.get('<s>')).toBe(-99);
  });
  it('gives every history a distribution that sums to one (seen and unseen histories)', () => {
    for (const h of [[], ['<s>'], ['steer'], ['<s>', 'left'], ['steer', 'tire'], ['tire', 'next'], ['bulge']]) {
      const sum = vocab.reduce((a, w) => a + p(h, w), 0);
      expect(sum).toBeCloseTo(1, 4);
    }
  });
  it('prefers what was seen', () => {
    expect(p(['steer', 'tire'], 'bulge')).toBeGreaterThan(p(['steer', 'tire'], 'next'));
    expect(p(['<s>'], 'left')).toBeGreaterThan(p(['<s>'], 'flat'));
  });
});
