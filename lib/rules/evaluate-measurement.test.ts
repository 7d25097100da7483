import { describe, expect, it } from 'vitest';
import { CHECK_NAMES, customizeProfile, evaluateMeasurement, findProfile, usFederalProfile } from './index';

describe('evaluateMeasurement: input it cannot judge', () => {
  it.each([
    [null, /JSON object/],
    [[1, 2], /JSON object/],
    ['tread', /JSON object/],
    [{}, /missing field "check"/],
    [{ check: 'brake_fade' }, /unknown check "brake_fade"/],
    [{ check: 42 }, /unknown check/],
    [{ check: 'tread_depth', position: 'steer' }, /missing field "value"/],
    [{ check: 'tread_depth', position: 'steer', value: -1 }, /must not be negative/],
    [{ check: 'tread_depth', position: 'steer', value: '4' }, /must be a number/],
    [{ check: 'tread_depth', position: 'steer', value: Number.NaN }, /must be a number/],
    [{ check: 'tread_depth', position: 'steer', value: Number.POSITIVE_INFINITY }, /finite/],
    [{ check: 'tread_depth', position: 'roof', value: 4 }, /"position" must be one of steer, drive, trailer/],
    [{ check: 'tread_depth', value: 4 }, /missing field "position"/],
    [{ check: 'tire_pressure', value: 100 }, /missing field "target"/],
    [{ check: 'tire_pressure', target: 0, value: 100 }, /greater than zero/],
    [{ check: 'air_buildup', from: 100, to: 85, seconds: 30 }, /must be above/],
    [{ check: 'air_leak', mode: 'applied', value: 2 }, /missing field "combination"/],
    [{ check: 'air_leak', mode: 'applied', combination: 'yes', value: 2 }, /true or false/],
    [{ check: 'air_leak', mode: 'parked', combination: false, value: 2 }, /"mode" must be one of/],
    [{ check: 'pushrod_stroke', value: 2 }, /missing field "chamber"/],
    [{ check: 'steering_lash', wheel_diameter: 0, power: true, value: 1 }, /greater than zero/],
    [{ check: 'windshield_damage', diameter: 1, nearest_other: null }, /missing field "in_critical_area"/],
    [{ check: 'rear_impact_guard', ground_clearance: 20, trailer_built_year: 1998.5 }, /whole number/],
    [{ check: 'rear_impact_guard', ground_clearance: 20 }, /missing field "trailer_built_year"/],
    [{ check: 'low_air_warning', value: 60, profile: 'mx' }, /unknown profile/],
  ])('%j → error', (input, pattern) => {
    const outcome = evaluateMeasurement(input);
    expect(outcome).toHaveProperty('error');
    expect((outcome as { error: string }).error).toMatch(pattern);
  });
});

describe('profiles', () => {
  it('defaults to US federal; "us" and "ca" are aliases', () => {
    expect(findProfile(undefined)?.id).toBe('us-federal');
    expect(findProfile('US')?.id).toBe('us-federal');
    expect(findProfile('ca')?.id).toBe('ca-nsc13');
    expect(findProfile('ca-nsc13')?.id).toBe('ca-nsc13');
    expect(evaluateMeasurement({ check: 'low_air_warning', value: 57 })).toMatchObject({
      profile: 'us-federal',
      verdict: 'fail',
    });
    expect(evaluateMeasurement({ check: 'low_air_warning', value: 57 }, { profile: 'ca' })).toMatchObject({
      profile: 'ca-nsc13',
      verdict: 'pass',
    });
    expect(
      evaluateMeasurement({ check: 'low_air_warning', value: 57, profile: 'us' }, { profile: 'ca' }),
    ).toMatchObject({ profile: 'us-federal' });
  });
  it('every check of the contract is known', () => {
    expect([...CHECK_NAMES].sort()).toEqual([
      'air_buildup',
      'air_leak',
      'governor_cutin',
      'governor_cutout',
      'low_air_warning',
      'pushrod_stroke',
      'rear_impact_guard',
      'steering_lash',
      'tire_pressure',
      'tread_depth',
      'windshield_damage',
    ]);
  });
  it('every rule names a source and a status', () => {
    for (const rule of Object.values(usFederalProfile.rules)) {
      expect(rule.source.citation.length).toBeGreaterThan(5);
      expect(['verified', 'partly-verified', 'from-memory', 'common-practice']).toContain(rule.source.status);
    }
  });
  it('an unverified value can be corrected without code changes', () => {
    const corrected = customizeProfile(usFederalProfile, {
      'pushrod_stroke.30': { limit: 2.125, source: { citation: '49 CFR 393.47(e) (checked)', status: 'verified' } },
    });
    expect(
      evaluateMeasurement({ check: 'pushrod_stroke', chamber: '30', value: 2.125 }, { profile: corrected }),
    ).toMatchObject({ verdict: 'pass', source: '49 CFR 393.47(e) (checked)' });
    expect(evaluateMeasurement({ check: 'pushrod_stroke', chamber: '30', value: 2.125 })).toMatchObject({
      verdict: 'fail',
    });
    expect(() => customizeProfile(usFederalProfile, { 'no.such.rule': { limit: 1 } })).toThrow();
  });
  it('the verdict line carries the contract fields', () => {
    const outcome = evaluateMeasurement({ check: 'governor_cutin', value: 104 });
    expect(Object.keys(outcome)).toEqual(expect.arrayContaining(['check', 'verdict', 'severity', 'limit', 'source']));
  });
  it('a fleet object on the line is used when the caller gives none', () => {
    expect(
      evaluateMeasurement({
        check: 'tread_depth',
        position: 'drive',
        value: 3,
        fleet: { limits: { 'tread_depth.drive': 4 } },
      }),
    ).toMatchObject({ verdict: 'fail', limit: 4 });
    expect(evaluateMeasurement({ check: 'tread_depth', position: 'drive', value: 3, fleet: 'strict' })).toHaveProperty(
      'error',
    );
  });
});
