import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CONFIRM_THRESHOLD, getDefaultMatcher } from './index';
import { getLabelledContext, isTopOneCorrect, parseLabelledJsonl } from './fixture-scoring';

const fixture = (name: string) =>
  parseLabelledJsonl(readFileSync(new URL(`../../tests/fixtures/matcher/${name}`, import.meta.url), 'utf8'));
const matcher = getDefaultMatcher();

describe('labelled utterances', () => {
  const set = fixture('utterances.jsonl');

  it('has at least 300 noisy utterances', () => {
    expect(set.length).toBeGreaterThanOrEqual(300);
  });

  it('top-1 accuracy is at least 95 %', () => {
    const misses: string[] = [];
    for (const u of set) {
      const r = matcher.match(u.text, getLabelledContext(u));
      if (!isTopOneCorrect(u, r))
        misses.push(
          `  "${u.text}" [${u.zone}] want ${u.termId ?? u.command ?? u.measure ?? u.kind} got ${r.kind} ${r.termId ?? ''} ${r.value ?? ''} (${r.score})`,
        );
    }
    const accuracy = 1 - misses.length / set.length;
    console.log(
      `top-1 accuracy ${(accuracy * 100).toFixed(1)} % (${set.length - misses.length}/${set.length})${misses.length ? `; misses:\n${misses.join('\n')}` : ''}`,
    );
    expect(accuracy).toBeGreaterThanOrEqual(0.95);
  });

  it('reads every labelled measurement exactly (numbers 100 %)', () => {
    const numbers = set.filter((u) => u.kind === 'measurement');
    const misses = numbers.filter((u) => !isTopOneCorrect(u, matcher.match(u.text, getLabelledContext(u))));
    console.log(`numbers: ${numbers.length - misses.length}/${numbers.length} right`);
    expect(misses.map((u) => u.text)).toEqual([]);
  });

  it('attaches the labelled position', () => {
    const withPos = set.filter((u) => u.position !== undefined);
    const misses = withPos.filter((u) => matcher.match(u.text, getLabelledContext(u)).position !== u.position);
    const acc = 1 - misses.length / withPos.length;
    console.log(
      `positions: ${withPos.length - misses.length}/${withPos.length}${misses.length ? ` (missed: ${misses.map((u) => u.text).join(' | ')})` : ''}`,
    );
    expect(acc).toBeGreaterThanOrEqual(0.9);
  });

  it('takes the best reading over several recogniser alternatives', () => {
    const r = matcher.matchAlternatives(
      ['glad and seal cracked up', 'glad hand seal cracked', 'glad ham sealed cracked'],
      { zone: 'coupling' },
    );
    expect(r.termId).toBe('glad_hand:cracked');
    const cmd = matcher.matchAlternatives(['necks', 'next'], {});
    expect(cmd.command).toBe('next');
  });
});

describe('first held-out set (93.6 % on its first run; its misses have since informed the vocabulary)', () => {
  it('reports top-1 accuracy and stays at or above 85 %', () => {
    const set = fixture('holdout.jsonl');
    const misses = set.filter((u) => !isTopOneCorrect(u, matcher.match(u.text, getLabelledContext(u))));
    const accuracy = 1 - misses.length / set.length;
    console.log(
      `held-out top-1 accuracy ${(accuracy * 100).toFixed(1)} % (${set.length - misses.length}/${set.length})${misses.length ? `; misses: ${misses.map((u) => `"${u.text}" want ${u.termId ?? u.command ?? u.measure}`).join(' | ')}` : ''}`,
    );
    expect(accuracy).toBeGreaterThanOrEqual(0.85);
  });
});

describe('second held-out set (written after all tuning; see the note in its commit for the first-run figure)', () => {
  it('reports top-1 accuracy and stays at or above 85 %', () => {
    const set = fixture('holdout-2.jsonl');
    const misses = set.filter((u) => !isTopOneCorrect(u, matcher.match(u.text, getLabelledContext(u))));
    const accuracy = 1 - misses.length / set.length;
    console.log(
      `held-out-2 top-1 accuracy ${(accuracy * 100).toFixed(1)} % (${set.length - misses.length}/${set.length})${
        misses.length
          ? `; misses: ${misses
              .map((u) => {
                const r = matcher.match(u.text, getLabelledContext(u));
                return `"${u.text}" want ${u.termId ?? u.command ?? u.measure} got ${r.termId}`;
              })
              .join(' | ')}`
          : ''
      }`,
    );
    expect(accuracy).toBeGreaterThanOrEqual(0.85);
  });
});

describe('chatter', () => {
  const chatter = fixture('chatter.jsonl');

  it('accepts at most 5 % of non-findings as a finding or measurement at the confirmation threshold', () => {
    expect(chatter.length).toBeGreaterThanOrEqual(60);
    const accepted = chatter
      .map((u) => ({ u, r: matcher.match(u.text, getLabelledContext(u)) }))
      .filter(({ r }) => (r.kind === 'defect' || r.kind === 'measurement') && r.score >= CONFIRM_THRESHOLD);
    const unknown = chatter.filter((u) => matcher.match(u.text, getLabelledContext(u)).kind === 'unknown').length;
    console.log(
      `chatter: ${accepted.length}/${chatter.length} accepted at ${CONFIRM_THRESHOLD}; ${unknown}/${chatter.length} unknown${accepted.length ? `: ${accepted.map(({ u, r }) => `"${u.text}" → ${r.termId} ${r.score}`).join(' | ')}` : ''}`,
    );
    expect(accepted.length / chatter.length).toBeLessThanOrEqual(0.05);
  });
});

describe('bad input', () => {
  const junk = [
    '',
    '   ',
    'x'.repeat(5000),
    'brake '.repeat(900),
    '\u0000\u0001\u0002\uffff\ud800',
    '😀🚛🔧',
    '🚛 🚛 🚛 🚛',
    '%%%$$$###',
    '\t\n\r',
    'ñáé ü',
  ];
  it.each(junk.map((j, i) => [i, j] as const))('input %i gives unknown and does not throw', (_i, text) => {
    const r = matcher.match(text, { zone: 'front' });
    expect(r.kind).toBe('unknown');
    expect(r.score).toBe(0);
  });
  it('survives values that are not strings and empty alternative lists', () => {
    expect(matcher.match(undefined as unknown as string).kind).toBe('unknown');
    expect(matcher.match(42 as unknown as string).kind).toBe('unknown');
    expect(matcher.matchAlternatives([]).kind).toBe('unknown');
    expect(matcher.matchAlternatives(null as unknown as string[]).kind).toBe('unknown');
  });
});
