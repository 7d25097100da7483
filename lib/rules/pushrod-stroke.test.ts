import { describe, expect, it } from 'vitest';
import { evaluateMeasurement, listUnverifiedRules, normalizeChamberKey, usFederalProfile } from './index';
import type { EvaluateOptions, EvaluationResult } from './index';

function judge(input: Record<string, unknown>, options?: EvaluateOptions): EvaluationResult {
  const outcome = evaluateMeasurement(input, options);
  if ('error' in outcome) throw new Error(outcome.error);
  return outcome;
}

// Every row of the 49 CFR 393.47(e) clamp-type chamber table, written out here as the oracle.
// [chamber marking, adjustment limit in, status]
const rows: Array<[string, number, string]> = [
  ['6', 1.25, 'from-memory'], // 49 CFR 393.47(e), type 6 — [M] from memory
  ['9', 1.375, 'from-memory'], // 49 CFR 393.47(e), type 9 — [M] from memory
  ['12', 1.375, 'partly-verified'], // 49 CFR 393.47(e), type 12 — [P]
  ['12L', 1.75, 'partly-verified'], // 49 CFR 393.47(e), type 12 long stroke — [P]
  ['16', 1.75, 'partly-verified'], // 49 CFR 393.47(e), type 16 — [P]
  ['16L', 2, 'verified'], // 49 CFR 393.47(e), type 16 long stroke — [V]
  ['20', 1.75, 'verified'], // 49 CFR 393.47(e), type 20 — [V]
  ['20L', 2, 'verified'], // 49 CFR 393.47(e), type 20 long stroke — [V]
  ['24', 1.75, 'from-memory'], // 49 CFR 393.47(e), type 24 — [M] from memory
  ['24L', 2, 'verified'], // 49 CFR 393.47(e), type 24 long stroke — [V]
  ['24L3', 2.5, 'verified'], // 49 CFR 393.47(e), type 24 long stroke, 3 in rated stroke — [V]
  ['30', 2, 'from-memory'], // 49 CFR 393.47(e), type 30 — [M] from memory (widely published)
  ['30L', 2.5, 'verified'], // 49 CFR 393.47(e), type 30 long stroke — [V]
  ['36', 2.25, 'from-memory'], // 49 CFR 393.47(e), type 36 — [M] from memory
  ['DD3-30', 2.25, 'from-memory'], // 49 CFR 393.47(e), DD-3 type 30 — [M] from memory
];

describe('pushrod stroke, 49 CFR 393.47(e) table', () => {
  it.each(rows)('type %s: at the %d in limit passes, 1/16 in over fails major', (chamber, limit, status) => {
    const atLimit = judge({ check: 'pushrod_stroke', chamber, value: limit });
    expect(atLimit).toMatchObject({ verdict: 'pass', limit, source_status: status });
    expect(atLimit.source).toMatch(/^49 CFR 393\.47\(e\)/);
    const over = judge({ check: 'pushrod_stroke', chamber, value: limit + 1 / 16 });
    expect(over).toMatchObject({ verdict: 'fail', severity: 'major', limit });
    expect(judge({ check: 'pushrod_stroke', chamber, value: limit - 1 / 16 }).verdict).toBe('pass');
  });

  it.each(rows)('type %s: Canadian profile uses the same limit, major (NSC 13 Schedule 1 Part 1)', (chamber, limit) => {
    expect(judge({ check: 'pushrod_stroke', chamber, value: limit, profile: 'ca' })).toMatchObject({
      verdict: 'pass',
      limit,
    });
    const over = judge({ check: 'pushrod_stroke', chamber, value: limit + 1 / 8, profile: 'ca' });
    expect(over).toMatchObject({ verdict: 'fail', severity: 'major', source_status: 'from-memory' });
    expect(over.source).toMatch(/NSC 13 Schedule 1 Part 1/);
  });

  // 49 CFR 393.47(e) worked example: 2-1/8 in on an unmarked type 30 is out of adjustment; on a 30LS it is within 2-1/2 in.
  it('worked example: 2-1/8 in fails a type 30 and passes a tagged 30LS', () => {
    const standard = judge({ check: 'pushrod_stroke', chamber: '30', value: 2.125 });
    expect(standard).toMatchObject({ verdict: 'fail', severity: 'major', limit: 2 });
    expect(standard.message).toContain('2-1/8 in');
    expect(judge({ check: 'pushrod_stroke', chamber: '30LS', value: 2.125 })).toMatchObject({
      verdict: 'pass',
      limit: 2.5,
    });
  });

  // Manitoba Driving Commercial Vehicles manual: adjust a type 30 when applied stroke is over 1-3/4 in (not a legal limit).
  it('type 30 over 1-3/4 in passes with "adjust soon"', () => {
    expect(judge({ check: 'pushrod_stroke', chamber: '30', value: 1.75 })).toMatchObject({
      level: 'pass',
      advisory: null,
    });
    const soon = judge({ check: 'pushrod_stroke', chamber: '30', value: 1.875 });
    expect(soon).toMatchObject({ verdict: 'pass', severity: null, level: 'advisory' });
    expect(soon.advisory).toMatch(/adjust soon/);
  });

  it('reads long-stroke markings as the trade writes them; unmarked is standard', () => {
    expect(normalizeChamberKey('30')).toBe('30');
    expect(normalizeChamberKey('30L')).toBe('30L');
    expect(normalizeChamberKey('30LS')).toBe('30L');
    expect(normalizeChamberKey('30 ls')).toBe('30L');
    expect(normalizeChamberKey('type 30 long stroke')).toBe('30L');
    expect(normalizeChamberKey('24L3')).toBe('24L3');
    expect(normalizeChamberKey('24 LS 3 in')).toBe('24L3');
    expect(normalizeChamberKey('DD-3')).toBe('DD3-30');
    expect(normalizeChamberKey('6L')).toBeNull();
    expect(normalizeChamberKey('31')).toBeNull();
    expect(evaluateMeasurement({ check: 'pushrod_stroke', chamber: 30, value: 1 })).toMatchObject({ verdict: 'pass' });
    expect(evaluateMeasurement({ check: 'pushrod_stroke', chamber: '31', value: 1 })).toHaveProperty('error');
  });

  it('unverified rows are listed for checking against the official text', () => {
    const ids = listUnverifiedRules(usFederalProfile).map((rule) => rule.id);
    expect(ids).toEqual(expect.arrayContaining(['pushrod_stroke.30', 'pushrod_stroke.6', 'pushrod_stroke.36']));
    expect(ids).not.toContain('pushrod_stroke.30L');
  });

  it('a fleet may tighten a chamber limit', () => {
    const fleet = { limits: { 'pushrod_stroke.30': 1.875 } };
    expect(judge({ check: 'pushrod_stroke', chamber: '30', value: 1.9 }, { fleet })).toMatchObject({
      verdict: 'fail',
      limit: 1.875,
      fleet_tightened: true,
    });
  });
});
