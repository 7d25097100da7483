import { describe, expect, it } from 'vitest';
import { evaluateMeasurement } from './index';
import type { EvaluateOptions, EvaluationResult } from './index';

function judge(input: Record<string, unknown>, options?: EvaluateOptions): EvaluationResult {
  const outcome = evaluateMeasurement(input, options);
  if ('error' in outcome) throw new Error(outcome.error);
  return outcome;
}

const spot = (diameter: number, nearest: number | null, extra: Record<string, unknown> = {}) =>
  judge({ check: 'windshield_damage', diameter, in_critical_area: true, nearest_other: nearest, ...extra });

describe('windshield damage, 49 CFR 393.60(c)', () => {
  // 49 CFR 393.60(c): only the protected area (top of the steering wheel up, less 2 in top / 1 in side borders).
  it('damage outside the protected area has no 393.60(c) limit', () => {
    const result = judge({ check: 'windshield_damage', diameter: 2, in_critical_area: false, nearest_other: null });
    expect(result).toMatchObject({ verdict: 'pass', severity: null, limit: null });
    expect(result.message).toMatch(/State law may still apply/);
  });

  // 49 CFR 393.60(c)(3): a spot a 3/4 in disc can cover, at least 3 in from any other.
  it('worked example: one 5/8 in chip alone is allowed', () => {
    expect(spot(0.625, null)).toMatchObject({ verdict: 'pass', limit: 0.75, source: '49 CFR 393.60(c)(3)' });
  });
  it('worked example: two 5/8 in chips 2 in apart fail', () => {
    expect(spot(0.625, 2)).toMatchObject({
      verdict: 'fail',
      severity: 'major',
      limit: 3,
      rule: 'us-federal/windshield_damage.spot_separation',
    });
  });
  it('disc boundary: 3/4 in passes, just over fails', () => {
    expect(spot(0.75, null).verdict).toBe('pass');
    expect(spot(0.76, null)).toMatchObject({ verdict: 'fail', limit: 0.75 });
  });
  it('spacing boundary: 3 in passes, just under fails', () => {
    expect(spot(0.5, 3).verdict).toBe('pass');
    expect(spot(0.5, 2.99).verdict).toBe('fail');
  });
  // 49 CFR 393.60(c)(2): a single crack not intersected by any other crack.
  it('worked example: two cracks that cross in the protected area fail', () => {
    expect(spot(0, null, { crack_intersections: 0 }).verdict).toBe('pass');
    expect(spot(0, null, { crack_intersections: 1 })).toMatchObject({
      verdict: 'fail',
      rule: 'us-federal/windshield_damage.crack_intersections',
    });
  });
  // 49 CFR 393.60(c)(2) crack width 1/4 in: [M] from memory.
  it('crack width: 1/4 in passes, wider fails (from memory)', () => {
    expect(spot(0, null, { crack_width: 0.25 }).verdict).toBe('pass');
    expect(spot(0, null, { crack_width: 0.3 })).toMatchObject({ verdict: 'fail', source_status: 'from-memory' });
  });
  // NSC 13 Schedule 1 Part 14: glass damage is a minor defect (no major listed).
  it('Canadian profile: the same damage is a minor defect', () => {
    expect(
      judge({ check: 'windshield_damage', diameter: 1, in_critical_area: true, nearest_other: null, profile: 'ca' }),
    ).toMatchObject({ verdict: 'fail', severity: 'minor' });
  });
});

describe('rear impact guard, 49 CFR 393.86', () => {
  const guard = (clearance: number, year: number, extra: Record<string, unknown> = {}) =>
    judge({ check: 'rear_impact_guard', ground_clearance: clearance, trailer_built_year: year, ...extra });

  // 49 CFR 393.86(a); FMVSS 224: built on/after 26 Jan 1998, ground clearance ≤ 22 in unladen.
  it('worked example: guard bottom at 23 in on a newer trailer fails; 22 in passes', () => {
    expect(guard(23, 2005)).toMatchObject({ verdict: 'fail', severity: 'major', limit: 22 });
    expect(guard(22, 2005)).toMatchObject({ verdict: 'pass', source: '49 CFR 393.86(a); FMVSS 224' });
  });
  // 49 CFR 393.86(b) [P]: built after 31 Dec 1952 and before 1998, guard bottom ≤ 30 in.
  it('older trailers: 30 in passes, over fails', () => {
    expect(guard(30, 1990)).toMatchObject({ verdict: 'pass', limit: 30, source_status: 'partly-verified' });
    expect(guard(30.5, 1990).verdict).toBe('fail');
    expect(guard(30, 1953).verdict).toBe('pass');
    expect(guard(29, 1997).verdict).toBe('pass');
  });
  it('trailers built in 1952 or before: no guard rule', () => {
    expect(guard(40, 1952)).toMatchObject({ verdict: 'pass', limit: null });
  });
  it('1998: the newer rule unless the build date is before 26 Jan 1998', () => {
    expect(guard(25, 1998)).toMatchObject({ verdict: 'fail', limit: 22 });
    expect(guard(25, 1998, { trailer_built_date: '1998-01-10' })).toMatchObject({ verdict: 'pass', limit: 30 });
    expect(guard(25, 1998, { trailer_built_date: '1998-01-26' })).toMatchObject({ verdict: 'fail', limit: 22 });
  });
  it('Canadian profile applies the same values, marked from memory', () => {
    expect(guard(23, 2005, { profile: 'ca' })).toMatchObject({
      verdict: 'fail',
      severity: 'major',
      source_status: 'from-memory',
    });
  });
});
