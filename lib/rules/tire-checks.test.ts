import { describe, expect, it } from 'vitest';
import { estimateColdPressure, evaluateMeasurement } from './index';
import type { EvaluateOptions, EvaluationResult } from './index';

function judge(input: Record<string, unknown>, options?: EvaluateOptions): EvaluationResult {
  const outcome = evaluateMeasurement(input, options);
  if ('error' in outcome) throw new Error(outcome.error);
  return outcome;
}

describe('tread depth, US federal', () => {
  // 49 CFR 393.75(b): steer tires at least 4/32 in.
  it('steer 4/32 passes, just under fails major', () => {
    expect(judge({ check: 'tread_depth', position: 'steer', value: 4 })).toMatchObject({
      verdict: 'pass',
      severity: null,
      limit: 4,
      source: '49 CFR 393.75(b)',
    });
    expect(judge({ check: 'tread_depth', position: 'steer', value: 3.9 })).toMatchObject({
      verdict: 'fail',
      severity: 'major',
      limit: 4,
    });
    expect(judge({ check: 'tread_depth', position: 'steer', value: 4.1 }).verdict).toBe('pass');
  });

  // 49 CFR 393.75(b) worked example; CVSA OOS level is [M] from memory.
  it('steer 3/32 breaks 393.75(b) but is not out of service', () => {
    const result = judge({ check: 'tread_depth', position: 'steer', value: 3 });
    expect(result).toMatchObject({ verdict: 'fail', severity: 'major', level: 'violation', oos: false });
    expect(result.message).toMatch(/does not reach the roadside out-of-service level/);
  });

  // CVSA OOS criteria, [M] from memory: steer under 2/32.
  it('steer under 2/32 also reaches the out-of-service level', () => {
    expect(judge({ check: 'tread_depth', position: 'steer', value: 2 })).toMatchObject({ oos: false });
    expect(judge({ check: 'tread_depth', position: 'steer', value: 1.9 })).toMatchObject({
      oos: true,
      level: 'out_of_service',
    });
  });

  // 49 CFR 393.75(c): all other positions at least 2/32 in.
  it.each(['drive', 'trailer'])('%s 2/32 passes, 1/32 fails (393.75(c) worked example)', (position) => {
    expect(judge({ check: 'tread_depth', position, value: 2 })).toMatchObject({
      verdict: 'pass',
      limit: 2,
      source: '49 CFR 393.75(c)',
    });
    expect(judge({ check: 'tread_depth', position, value: 1.9 })).toMatchObject({
      verdict: 'fail',
      severity: 'major',
      oos: false,
    });
    // CVSA OOS, [M] from memory: under 1/32 in for other positions.
    expect(judge({ check: 'tread_depth', position, value: 1 })).toMatchObject({ verdict: 'fail', oos: false });
    expect(judge({ check: 'tread_depth', position, value: 0.5 })).toMatchObject({ verdict: 'fail', oos: true });
  });
});

describe('tread depth, Canadian profile', () => {
  // NSC 13 Schedule 1 Part 21 (tread below the wear limit: major); wear-limit values [M] from memory.
  it.each([
    ['steer', 4],
    ['drive', 2],
    ['trailer', 2],
  ] as const)('%s at %d/32 passes, under it fails major', (position, limit) => {
    expect(judge({ check: 'tread_depth', position, value: limit, profile: 'ca' })).toMatchObject({
      verdict: 'pass',
      profile: 'ca-nsc13',
      limit,
    });
    const fail = judge({ check: 'tread_depth', position, value: limit - 0.5, profile: 'ca' });
    expect(fail).toMatchObject({ verdict: 'fail', severity: 'major', source_status: 'from-memory' });
    expect(fail.source).toMatch(/NSC 13 Schedule 1 Part 21/);
  });
});

describe('tread depth, fleet tightening', () => {
  it('a stricter fleet minimum applies, a looser one is ignored', () => {
    const tighter = judge(
      { check: 'tread_depth', position: 'steer', value: 5 },
      { fleet: { limits: { 'tread_depth.steer': 6 } } },
    );
    expect(tighter).toMatchObject({ verdict: 'fail', limit: 6, fleet_tightened: true });
    expect(tighter.source).toMatch(/^fleet setting; published: 49 CFR 393.75\(b\)/);
    const looser = judge(
      { check: 'tread_depth', position: 'steer', value: 3 },
      { fleet: { limits: { 'tread_depth.steer': 2 } } },
    );
    expect(looser).toMatchObject({ verdict: 'fail', limit: 4, fleet_ignored: true });
  });
});

describe('tire pressure', () => {
  // CVSA definition of flat (truckinginfo 2013), 49 CFR 393.75(a)(3): at or below 50% of the maximum cold pressure.
  it('worked example: max 120 psi, gauge 58 psi → flat, major', () => {
    const result = judge({ check: 'tire_pressure', target: 100, value: 58, max_cold: 120 });
    expect(result).toMatchObject({
      verdict: 'fail',
      severity: 'major',
      limit: 60,
      rule: 'us-federal/tire_pressure.flat',
    });
    expect(result.message).toMatch(/flat/);
  });

  it('flat threshold boundary: 60 of 120 is flat, 60.5 is not', () => {
    expect(judge({ check: 'tire_pressure', target: 100, value: 60, max_cold: 120 }).rule).toBe(
      'us-federal/tire_pressure.flat',
    );
    const above = judge({ check: 'tire_pressure', target: 100, value: 60.5, max_cold: 120 });
    expect(above).toMatchObject({
      verdict: 'fail',
      severity: 'minor',
      rule: 'us-federal/tire_pressure.target',
      limit: 100,
    });
  });

  // Fleet cold target; 49 CFR 393.75(h)(1) requires at least the load table's cold pressure.
  it('cold target: at target passes, under it is a minor defect', () => {
    expect(judge({ check: 'tire_pressure', target: 100, value: 100 })).toMatchObject({ verdict: 'pass', limit: 100 });
    expect(judge({ check: 'tire_pressure', target: 100, value: 99.5 })).toMatchObject({
      verdict: 'fail',
      severity: 'minor',
    });
  });

  it('without max_cold, half the target counts as flat (never looser than the sidewall rule)', () => {
    expect(judge({ check: 'tire_pressure', target: 100, value: 50 })).toMatchObject({ severity: 'major', limit: 50 });
    expect(judge({ check: 'tire_pressure', target: 100, value: 51 })).toMatchObject({ severity: 'minor' });
  });

  it('above the sidewall maximum cold pressure passes with an advisory', () => {
    const result = judge({ check: 'tire_pressure', target: 100, value: 125, max_cold: 120 });
    expect(result).toMatchObject({ verdict: 'pass', level: 'advisory' });
    expect(result.advisory).toMatch(/maximum cold pressure/);
  });

  it('fleet targets by position may raise the target, never lower it', () => {
    const fleet = { tirePressureTargets: { steer: 110, drive: 90 } };
    expect(judge({ check: 'tire_pressure', target: 100, value: 105, position: 'steer' }, { fleet })).toMatchObject({
      verdict: 'fail',
      limit: 110,
      fleet_tightened: true,
    });
    expect(judge({ check: 'tire_pressure', target: 100, value: 95, position: 'drive' }, { fleet })).toMatchObject({
      verdict: 'fail',
      limit: 100,
      fleet_ignored: true,
    });
  });

  // 49 CFR 393.75(h)(2) Table 1, 41–55 mph row: 5 psi (≤4,000 lb) or 15 psi (>4,000 lb).
  it('worked example: tire rated 6,175 lb reads 110 psi hot at 50 mph → estimated cold 95 psi', () => {
    expect(estimateColdPressure(110, 6175, 50)).toBe(95);
    expect(estimateColdPressure(110, 4000, 50)).toBe(105);
    expect(estimateColdPressure(110, 6175, 60)).toBeNull();
    const result = judge({
      check: 'tire_pressure',
      target: 100,
      value: 110,
      hot: true,
      rated_load_lb: 6175,
      avg_speed_mph: 50,
    });
    expect(result).toMatchObject({ verdict: 'fail', severity: 'minor', limit: 100 });
    expect(result.message).toMatch(/estimated cold/);
    expect(
      evaluateMeasurement({
        check: 'tire_pressure',
        target: 100,
        value: 110,
        hot: true,
        rated_load_lb: 6175,
        avg_speed_mph: 70,
      }),
    ).toHaveProperty('error');
  });

  // NSC 13 Schedule 1 Part 21: flat tire is a major defect.
  it('Canadian profile: flat is major, under target minor', () => {
    expect(judge({ check: 'tire_pressure', target: 100, value: 58, max_cold: 120, profile: 'ca' })).toMatchObject({
      severity: 'major',
    });
    expect(judge({ check: 'tire_pressure', target: 100, value: 90, max_cold: 120, profile: 'ca' })).toMatchObject({
      severity: 'minor',
    });
  });
});
