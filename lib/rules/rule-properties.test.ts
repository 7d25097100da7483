import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { caNsc13Profile, evaluateMeasurement, pushrodStrokeTable, usFederalProfile } from './index';
import type { EvaluationOutcome, FleetSettings } from './index';

const size = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const optional = <T>(arbitrary: fc.Arbitrary<T>) => fc.option(arbitrary, { nil: undefined });

/** Valid measurements of every check, both profiles. */
const measurement: fc.Arbitrary<Record<string, unknown>> = fc
  .oneof(
    fc.record({
      check: fc.constant('tread_depth'),
      position: fc.constantFrom('steer', 'drive', 'trailer'),
      value: size(0, 32),
    }),
    fc.record({
      check: fc.constant('tire_pressure'),
      target: size(1, 150),
      value: size(0, 200),
      max_cold: optional(size(1, 200)),
      position: optional(fc.constantFrom('steer', 'drive', 'trailer')),
    }),
    fc.record({ check: fc.constant('low_air_warning'), value: size(0, 150) }),
    fc
      .record({
        check: fc.constant('air_buildup'),
        from: size(0, 130),
        span: size(0.5, 60),
        seconds: size(0, 600),
        system: fc.constantFrom('dual', 'single'),
      })
      .map(({ span, ...rest }) => ({ ...rest, to: rest.from + span })),
    fc.record({ check: fc.constantFrom('governor_cutout', 'governor_cutin'), value: size(0, 200) }),
    fc.record({
      check: fc.constant('air_leak'),
      mode: fc.constantFrom('applied', 'released'),
      combination: fc.boolean(),
      value: size(0, 20),
      trailers: optional(fc.integer({ min: 0, max: 3 })),
    }),
    fc.record({
      check: fc.constant('pushrod_stroke'),
      chamber: fc.constantFrom(...pushrodStrokeTable.map((row) => row.key), '30LS', 'type 24 long stroke'),
      value: size(0, 4),
    }),
    fc.record({
      check: fc.constant('steering_lash'),
      wheel_diameter: fc.oneof(fc.constantFrom(16, 18, 19, 20, 21, 22), size(10, 26)),
      power: fc.boolean(),
      value: size(0, 10),
    }),
    fc.record({
      check: fc.constant('windshield_damage'),
      diameter: size(0, 3),
      in_critical_area: fc.boolean(),
      nearest_other: fc.option(size(0, 10), { nil: null }),
      crack_width: optional(size(0, 1)),
      crack_intersections: optional(fc.integer({ min: 0, max: 3 })),
    }),
    fc.record({
      check: fc.constant('rear_impact_guard'),
      ground_clearance: size(0, 40),
      trailer_built_year: fc.integer({ min: 1940, max: 2030 }),
    }),
  )
  .chain((fields) => fc.constantFrom('us', 'ca').map((profile) => ({ ...fields, profile })));

const ruleIds = [...new Set([...Object.keys(usFederalProfile.rules), ...Object.keys(caNsc13Profile.rules)])];

/** Any fleet settings at all: tighter, looser, zero, nonsense. */
const fleet: fc.Arbitrary<FleetSettings> = fc.record({
  limits: fc.dictionary(
    fc.constantFrom(...ruleIds),
    fc.oneof(size(0, 300), fc.constantFrom(-1, Number.NaN, Number.POSITIVE_INFINITY)),
  ),
  tirePressureTargets: fc.record(
    { steer: optional(size(0, 200)), drive: optional(size(0, 200)), trailer: optional(size(0, 200)) },
    { requiredKeys: [] },
  ),
});

const isError = (outcome: EvaluationOutcome): outcome is { error: string } => 'error' in outcome;

describe('rule properties', () => {
  it('no input makes a rule throw; bad input gets an error, never an internal one', () => {
    const anyField = fc.oneof(
      fc.anything(),
      size(-1e6, 1e6),
      fc.constantFrom(Number.NaN, -0, Number.POSITIVE_INFINITY, '', 'steer', '30L', true, null),
    );
    const fuzzed = fc.oneof(
      fc.anything(),
      measurement,
      measurement.chain((fields) =>
        fc
          .dictionary(fc.constantFrom(...Object.keys(fields), 'fleet', 'profile', 'position', 'chamber'), anyField)
          .map((noise) => ({ ...fields, ...noise })),
      ),
    );
    fc.assert(
      fc.property(fuzzed, fc.option(fleet, { nil: undefined }), (input, fleetSettings) => {
        let outcome: EvaluationOutcome | undefined;
        expect(() => {
          outcome = evaluateMeasurement(input, fleetSettings ? { fleet: fleetSettings } : {});
        }).not.toThrow();
        if (outcome && isError(outcome)) expect(outcome.error).not.toMatch(/^internal error/);
        else expect(['pass', 'fail']).toContain(outcome?.verdict);
      }),
      { numRuns: 3000 },
    );
  });

  it('valid measurements always get a verdict with the contract fields', () => {
    fc.assert(
      fc.property(measurement, (input) => {
        const outcome = evaluateMeasurement(input);
        if (isError(outcome)) throw new Error(`${JSON.stringify(input)} → ${outcome.error}`);
        expect(outcome.check).toBe(input.check);
        expect(outcome.severity === null).toBe(outcome.verdict === 'pass');
        expect(typeof outcome.source).toBe('string');
      }),
      { numRuns: 2000 },
    );
  });

  it('a fleet setting never turns a published fail into a pass', () => {
    fc.assert(
      fc.property(measurement, fleet, (input, fleetSettings) => {
        const published = evaluateMeasurement(input);
        const withFleet = evaluateMeasurement(input, { fleet: fleetSettings });
        if (isError(published) || isError(withFleet)) throw new Error('valid input must be judged');
        if (published.verdict === 'fail') expect(withFleet.verdict).toBe('fail');
      }),
      { numRuns: 3000 },
    );
  });

  it('tightening a fleet setting further never turns a fail into a pass', () => {
    fc.assert(
      fc.property(
        measurement.chain((input) =>
          fc.tuple(
            fc.constant(input),
            fc.constantFrom(...ruleIds.filter((id) => id.startsWith(`${String(input.check)}.`))),
          ),
        ),
        size(0, 300),
        size(0, 1),
        ([input, id], value, step) => {
          const rule = usFederalProfile.rules[id] ?? caNsc13Profile.rules[id];
          if (!rule) return;
          const stricter = rule.direction === 'min' ? value * (1 + step) : value * (1 - step);
          const loose = evaluateMeasurement(input, { fleet: { limits: { [id]: value } } });
          const tight = evaluateMeasurement(input, { fleet: { limits: { [id]: stricter } } });
          if (isError(loose) || isError(tight)) throw new Error('valid input must be judged');
          if (loose.verdict === 'fail') expect(tight.verdict).toBe('fail');
        },
      ),
      { numRuns: 3000 },
    );
  });
});
