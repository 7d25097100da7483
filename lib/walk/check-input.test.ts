import { describe, expect, it } from 'vitest';
import { DEFAULT_TIRE_PRESSURE_TOLERANCE_PSI, judgeReading, type CheckContext } from './check-input';

const ctx: CheckContext = {
  tractorAxles: [{ position: 'steer', tires: ['LF', 'RF'], coldPsi: 110, chamber: '24' }],
  trailerAxles: [],
  hasTrailer: false,
  trailerYear: null,
  fleetTargets: { steer: 110, drive: 100, trailer: 100 },
};
const steerPressure = { id: 'front.steer_pressure', component: 'steer_tire', measure: 'tire_pressure' as const };

describe('judgeReading', () => {
  it('a pressure within the gauge tolerance of the cold target passes and says why', () => {
    // Tolerance: common practice, no published source (DEFAULT_TIRE_PRESSURE_TOLERANCE_PSI).
    const v = judgeReading(steerPressure, { value: 109 }, ctx, 'us-federal');
    expect(v).toMatchObject({ judged: true, withinTolerance: true, result: { verdict: 'pass', severity: null } });
  });
  it('below target by more than the tolerance is a minor defect', () => {
    const v = judgeReading(steerPressure, { value: 110 - DEFAULT_TIRE_PRESSURE_TOLERANCE_PSI - 1 }, ctx, 'us-federal');
    expect(v).toMatchObject({ judged: true, withinTolerance: false, result: { verdict: 'fail', severity: 'minor' } });
  });
  it('the fleet sets its own tolerance; 0 means the target itself', () => {
    expect(judgeReading(steerPressure, { value: 109 }, { ...ctx, tirePressureTolerancePsi: 0 }, 'us')).toMatchObject({
      result: { verdict: 'fail' },
    });
    expect(judgeReading(steerPressure, { value: 106 }, { ...ctx, tirePressureTolerancePsi: 5 }, 'us')).toMatchObject({
      result: { verdict: 'pass' },
    });
  });
  it('a flat tire is never within tolerance (CVSA: at or below half the target without a sidewall maximum)', () => {
    expect(judgeReading(steerPressure, { value: 50 }, { ...ctx, tirePressureTolerancePsi: 10 }, 'us')).toMatchObject({
      result: { verdict: 'fail', severity: 'major' },
    });
  });
});
