import { describe, expect, it } from 'vitest';
import { evaluateMeasurement } from './index';
import type { EvaluateOptions, EvaluationResult } from './index';

function judge(input: Record<string, unknown>, options?: EvaluateOptions): EvaluationResult {
  const outcome = evaluateMeasurement(input, options);
  if ('error' in outcome) throw new Error(outcome.error);
  return outcome;
}

describe('low-air warning', () => {
  // CDL manual §5.3 step 7; FMVSS 121 S5.1.5: warning before pressure falls below 60 psi.
  it('US worked example: 62 psi passes, 52 psi fails major', () => {
    expect(judge({ check: 'low_air_warning', value: 62 })).toMatchObject({ verdict: 'pass', limit: 60 });
    expect(judge({ check: 'low_air_warning', value: 52 })).toMatchObject({ verdict: 'fail', severity: 'major' });
  });
  it('US boundary: 60 passes, 59.9 fails', () => {
    expect(judge({ check: 'low_air_warning', value: 60 }).verdict).toBe('pass');
    expect(judge({ check: 'low_air_warning', value: 59.9 }).verdict).toBe('fail');
  });
  // MTO Official Air Brake Handbook: defective if not on by 55 psi (380 kPa); NSC Part 1 major.
  it('Canadian boundary: 55 passes, 54.9 fails major; 57 passes with an advisory (most units warn above 60)', () => {
    expect(judge({ check: 'low_air_warning', value: 55, profile: 'ca' })).toMatchObject({ verdict: 'pass', limit: 55 });
    expect(judge({ check: 'low_air_warning', value: 54.9, profile: 'ca' })).toMatchObject({
      verdict: 'fail',
      severity: 'major',
    });
    expect(judge({ check: 'low_air_warning', value: 57, profile: 'ca' })).toMatchObject({
      verdict: 'pass',
      level: 'advisory',
    });
    expect(judge({ check: 'low_air_warning', value: 62, profile: 'ca' })).toMatchObject({
      level: 'pass',
      advisory: null,
    });
  });
  it('a fleet may ask for the warning higher, never lower', () => {
    expect(
      judge({ check: 'low_air_warning', value: 62 }, { fleet: { limits: { 'low_air_warning.min': 65 } } }).verdict,
    ).toBe('fail');
    expect(
      judge({ check: 'low_air_warning', value: 57 }, { fleet: { limits: { 'low_air_warning.min': 55 } } }).verdict,
    ).toBe('fail');
  });
});

describe('air build-up', () => {
  // CDL manual §5.3 step 7: dual system 85 → 100 psi within 45 s at operating rpm.
  it('US dual: 45 s passes, 45.5 s fails minor; worked example 52 s fails', () => {
    expect(judge({ check: 'air_buildup', from: 85, to: 100, seconds: 45 })).toMatchObject({
      verdict: 'pass',
      limit: 45,
    });
    expect(judge({ check: 'air_buildup', from: 85, to: 100, seconds: 45.5 })).toMatchObject({
      verdict: 'fail',
      severity: 'minor',
    });
    const worked = judge({ check: 'air_buildup', from: 85, to: 100, seconds: 52 });
    expect(worked).toMatchObject({ verdict: 'fail', severity: 'minor' });
    expect(worked.message).toMatch(/maker/);
  });
  // CDL manual §5.3 step 7: single system (pre-1975) 50 → 90 psi within 3 min.
  it('US single: 180 s passes, 181 s fails', () => {
    expect(judge({ check: 'air_buildup', from: 50, to: 90, seconds: 180, system: 'single' })).toMatchObject({
      verdict: 'pass',
      limit: 180,
    });
    expect(judge({ check: 'air_buildup', from: 50, to: 90, seconds: 181, system: 'single' }).verdict).toBe('fail');
  });
  // MTO Official Air Brake Handbook §10.3: over 2 min = defective; NSC slow build-up is minor.
  it('Canadian: worked example 95 s passes; 120 s passes, 121 s fails minor', () => {
    expect(judge({ check: 'air_buildup', from: 85, to: 100, seconds: 95, profile: 'ca' }).verdict).toBe('pass');
    expect(judge({ check: 'air_buildup', from: 85, to: 100, seconds: 120, profile: 'ca' }).verdict).toBe('pass');
    expect(judge({ check: 'air_buildup', from: 85, to: 100, seconds: 121, profile: 'ca' })).toMatchObject({
      verdict: 'fail',
      severity: 'minor',
    });
  });
  it('another span is judged against the limit scaled to it', () => {
    const result = judge({ check: 'air_buildup', from: 80, to: 110, seconds: 85 });
    expect(result).toMatchObject({ verdict: 'pass', limit: 90, prorated: true });
    expect(judge({ check: 'air_buildup', from: 80, to: 110, seconds: 91 }).verdict).toBe('fail');
  });
});

describe('governor', () => {
  // CDL manual §5.3: cut-out about 125 psi; ±10 psi band is common practice, no published source.
  it('US cut-out: worked example 128 psi normal; band 115–135', () => {
    expect(judge({ check: 'governor_cutout', value: 128 })).toMatchObject({
      verdict: 'pass',
      range: { min: 115, max: 135 },
    });
    expect(judge({ check: 'governor_cutout', value: 135 }).verdict).toBe('pass');
    expect(judge({ check: 'governor_cutout', value: 136 })).toMatchObject({
      verdict: 'fail',
      severity: 'minor',
      limit: 135,
      source_status: 'common-practice',
    });
    expect(judge({ check: 'governor_cutout', value: 115 }).verdict).toBe('pass');
    expect(judge({ check: 'governor_cutout', value: 114 })).toMatchObject({ verdict: 'fail', limit: 115 });
  });
  // MTO Truck Handbook §6-1-4: cut-out never above 145 psi (1000 kPa).
  it('Canadian cut-out: 145 passes; worked example 150 psi defective', () => {
    expect(judge({ check: 'governor_cutout', value: 145, profile: 'ca' })).toMatchObject({ verdict: 'pass' });
    expect(judge({ check: 'governor_cutout', value: 150, profile: 'ca' })).toMatchObject({
      verdict: 'fail',
      limit: 145,
      source_status: 'verified',
    });
  });
  // FMVSS 121 as amended by 61 FR 6173 (1996): cut-in at 100 psi or more; CDL manual §5.3 "about 100".
  it('US cut-in: worked example 104 normal; 100 passes; worked example 90 fails', () => {
    expect(judge({ check: 'governor_cutin', value: 104 }).verdict).toBe('pass');
    expect(judge({ check: 'governor_cutin', value: 100 }).verdict).toBe('pass');
    expect(judge({ check: 'governor_cutin', value: 99.5 }).verdict).toBe('fail');
    expect(judge({ check: 'governor_cutin', value: 90 })).toMatchObject({
      verdict: 'fail',
      severity: 'minor',
      limit: 100,
    });
  });
  // MTO Truck Handbook §6-1-4: operating range 80–145 psi.
  it('Canadian cut-in: 80 passes (advisory under 100), 79 fails', () => {
    expect(judge({ check: 'governor_cutin', value: 80, profile: 'ca' })).toMatchObject({
      verdict: 'pass',
      level: 'advisory',
    });
    expect(judge({ check: 'governor_cutin', value: 79, profile: 'ca' }).verdict).toBe('fail');
    expect(judge({ check: 'governor_cutin', value: 105, profile: 'ca' })).toMatchObject({ level: 'pass' });
  });
});

describe('air leakage in one minute', () => {
  const leak = (mode: string, combination: boolean, value: number, extra: Record<string, unknown> = {}) =>
    judge({ check: 'air_leak', mode, combination, value, ...extra });

  it('released, single vehicle: under 2 psi passes, 2 psi fails', () => {
    // CDL manual §5.3 static leakage: single vehicle < 2 psi/min.
    expect(leak('released', false, 1.9)).toMatchObject({ verdict: 'pass', limit: 2 });
    expect(leak('released', false, 2)).toMatchObject({ verdict: 'fail', severity: 'major' });
  });
  it('released, combination: worked example 2 psi passes, 3 psi fails', () => {
    // CDL manual §5.3 static leakage: combination < 3 psi/min.
    expect(leak('released', true, 2)).toMatchObject({ verdict: 'pass', limit: 3 });
    expect(leak('released', true, 2.9).verdict).toBe('pass');
    expect(leak('released', true, 3).verdict).toBe('fail');
  });
  it('released, three or more vehicles: under 5 passes', () => {
    // California DMV Commercial Driver Handbook: 5 psi/min for three or more vehicles.
    expect(leak('released', true, 4.9, { trailers: 2 })).toMatchObject({ verdict: 'pass', limit: 5 });
    expect(leak('released', true, 5, { trailers: 2 }).verdict).toBe('fail');
  });
  it('applied, single vehicle: 3 psi passes, over fails', () => {
    // CDL manual §5.3 applied leakage: single ≤ 3 psi/min.
    expect(leak('applied', false, 3)).toMatchObject({ verdict: 'pass', limit: 3 });
    expect(leak('applied', false, 3.1)).toMatchObject({ verdict: 'fail', severity: 'major' });
  });
  it('applied, combination: 4 psi passes; worked example 120 → 115 psi (5 psi) fails', () => {
    // CDL manual §5.3 applied leakage: combination of two ≤ 4 psi/min.
    expect(leak('applied', true, 4)).toMatchObject({ verdict: 'pass', limit: 4 });
    expect(leak('applied', true, 120 - 115)).toMatchObject({ verdict: 'fail', severity: 'major', limit: 4 });
  });
  it('applied, three or more vehicles: 6 psi passes, over fails', () => {
    // California DMV Commercial Driver Handbook: ≤ 6 psi/min for three or more vehicles.
    expect(leak('applied', true, 6, { trailers: 2 })).toMatchObject({ verdict: 'pass', limit: 6 });
    expect(leak('applied', true, 6.1, { trailers: 2 }).verdict).toBe('fail');
  });
  it('Canadian applied: over 3 psi single, over 4 psi combination is major', () => {
    // MTO Truck Handbook §6-1-4: over 3 psi (21 kPa) Class D, over 4 psi (28 kPa) Class A; NSC Part 1 major.
    expect(leak('applied', false, 3, { profile: 'ca' })).toMatchObject({ verdict: 'pass', source_status: 'verified' });
    expect(leak('applied', false, 3.1, { profile: 'ca' })).toMatchObject({ verdict: 'fail', severity: 'major' });
    expect(leak('applied', true, 4, { profile: 'ca' }).verdict).toBe('pass');
    expect(leak('applied', true, 4.1, { profile: 'ca' }).verdict).toBe('fail');
    // About 6 psi (41 kPa) with two or more trailers: [M] from memory.
    expect(leak('applied', true, 6, { profile: 'ca', trailers: 2 })).toMatchObject({
      verdict: 'pass',
      source_status: 'from-memory',
    });
    expect(leak('applied', true, 6.1, { profile: 'ca', trailers: 2 }).verdict).toBe('fail');
  });
  it('Canadian released: CDL values, [M] from memory', () => {
    expect(leak('released', false, 1.9, { profile: 'ca' })).toMatchObject({
      verdict: 'pass',
      source_status: 'from-memory',
    });
    expect(leak('released', false, 2, { profile: 'ca' }).verdict).toBe('fail');
    expect(leak('released', true, 2.9, { profile: 'ca' }).verdict).toBe('pass');
    expect(leak('released', true, 3, { profile: 'ca' }).verdict).toBe('fail');
  });
});
