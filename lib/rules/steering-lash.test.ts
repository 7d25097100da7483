import { describe, expect, it } from 'vitest';
import { convertLashAngleToInches, evaluateMeasurement } from './index';
import type { EvaluateOptions, EvaluationResult } from './index';

function judge(input: Record<string, unknown>, options?: EvaluateOptions): EvaluationResult {
  const outcome = evaluateMeasurement(input, options);
  if ('error' in outcome) throw new Error(outcome.error);
  return outcome;
}

// Every row of the 49 CFR 393.209(b) table: [wheel diameter in, manual max in, power max in].
const rows: Array<[number, number, number]> = [
  [16, 2, 4.5], // 49 CFR 393.209(b); manual [V] (= 49 CFR 570.60 Table 2), power [M] from memory
  [18, 2.25, 4.75], // 49 CFR 393.209(b); manual [V] (= 49 CFR 570.60 Table 2), power [M] from memory
  [19, 2.375, 5], // 49 CFR 393.209(b); manual [M], power [M] from memory
  [20, 2.5, 5.25], // 49 CFR 393.209(b); manual [V] (= 49 CFR 570.60 Table 2), power [M] from memory
  [21, 2.625, 5.5], // 49 CFR 393.209(b); manual [M], power [M] from memory
  [22, 2.75, 5.75], // 49 CFR 393.209(b); manual [V] (= 49 CFR 570.60 Table 2), power [M] from memory
];

describe('steering lash, 49 CFR 393.209(b) table', () => {
  it.each(rows)('%d in wheel, manual steering: %d in passes, 1/16 over fails major', (diameter, manual) => {
    const at = judge({ check: 'steering_lash', wheel_diameter: diameter, power: false, value: manual });
    expect(at).toMatchObject({ verdict: 'pass', limit: manual, rule: `us-federal/steering_lash.manual.${diameter}` });
    expect(at.source).toMatch(/^49 CFR 393\.209\(b\)/);
    expect(
      judge({ check: 'steering_lash', wheel_diameter: diameter, power: false, value: manual + 1 / 16 }),
    ).toMatchObject({ verdict: 'fail', severity: 'major' });
  });

  it.each(rows)('%d in wheel, power steering: %d/%d in passes, 1/16 over fails major', (diameter, _manual, power) => {
    expect(judge({ check: 'steering_lash', wheel_diameter: diameter, power: true, value: power })).toMatchObject({
      verdict: 'pass',
      limit: power,
      source_status: 'from-memory',
    });
    expect(
      judge({ check: 'steering_lash', wheel_diameter: diameter, power: true, value: power + 1 / 16 }),
    ).toMatchObject({ verdict: 'fail', severity: 'major' });
  });

  it.each(rows)(
    '%d in wheel: Canadian profile, lash over the limit is major (NSC 13 Schedule 1 Part 19, [M])',
    (diameter, manual, power) => {
      expect(
        judge({ check: 'steering_lash', wheel_diameter: diameter, power: false, value: manual + 0.1, profile: 'ca' }),
      ).toMatchObject({ verdict: 'fail', severity: 'major' });
      expect(
        judge({ check: 'steering_lash', wheel_diameter: diameter, power: true, value: power, profile: 'ca' }).verdict,
      ).toBe('pass');
    },
  );

  // 49 CFR 393.209(b) worked example: 20 in power wheel, 4 in lash → within 5-1/4; same 4 in on manual → over 2-1/2.
  it('worked example: 4 in on a 20 in wheel passes power, fails manual', () => {
    expect(judge({ check: 'steering_lash', wheel_diameter: 20, power: true, value: 4 }).verdict).toBe('pass');
    expect(judge({ check: 'steering_lash', wheel_diameter: 20, power: false, value: 4 })).toMatchObject({
      verdict: 'fail',
      severity: 'major',
    });
  });

  // 49 CFR 393.209(b)(2): lash = π × D × angle / 360.
  it('angle identity: 20 in × 14° ≈ 2.44 in, 20 in × 30° ≈ 5.24 in', () => {
    expect(convertLashAngleToInches(20, 14)).toBeCloseTo(2.443, 3);
    expect(convertLashAngleToInches(20, 30)).toBeCloseTo(5.236, 3);
  });

  // 49 CFR 393.209(b)(2), [M] from memory: other diameters, 14° manual, 30° power.
  it('other diameters use the angle: 17 in manual 14°, 24 in power 30°', () => {
    const limit17 = (Math.PI * 17 * 14) / 360;
    expect(judge({ check: 'steering_lash', wheel_diameter: 17, power: false, value: limit17 - 0.01 })).toMatchObject({
      verdict: 'pass',
      rule: 'us-federal/steering_lash.manual.other',
    });
    expect(judge({ check: 'steering_lash', wheel_diameter: 17, power: false, value: limit17 + 0.01 })).toMatchObject({
      verdict: 'fail',
      limit: 2.077,
    });
    const limit24 = (Math.PI * 24 * 30) / 360;
    expect(judge({ check: 'steering_lash', wheel_diameter: 24, power: true, value: limit24 })).toMatchObject({
      verdict: 'pass',
      limit: 6.283,
    });
    expect(judge({ check: 'steering_lash', wheel_diameter: 24, power: true, value: limit24 + 0.01 }).verdict).toBe(
      'fail',
    );
  });

  // CDL manual rule of thumb (10°) is an advisory; CVSA OOS (30° manual / 45° power) is [M] from memory.
  it('keeps the rule of thumb, the violation and the out-of-service level apart', () => {
    const thumb = judge({ check: 'steering_lash', wheel_diameter: 20, power: false, value: 2 });
    expect(thumb).toMatchObject({ verdict: 'pass', level: 'advisory' });
    expect(judge({ check: 'steering_lash', wheel_diameter: 20, power: false, value: 1.5 })).toMatchObject({
      level: 'pass',
    });
    expect(judge({ check: 'steering_lash', wheel_diameter: 20, power: false, value: 4 })).toMatchObject({
      level: 'violation',
      oos: false,
    });
    expect(judge({ check: 'steering_lash', wheel_diameter: 20, power: false, value: 5.3 })).toMatchObject({
      level: 'out_of_service',
      oos: true,
    });
  });
});
