import { describe, expect, it } from 'vitest';
import { matchUtterance } from './index';

describe('the step being measured and the words said', () => {
  it('a measurement named in the utterance wins over the step in front of the driver', () => {
    const r = matchUtterance('governor cut out one twenty five psi', {
      zone: 'air_brake_tests',
      measure: 'air_buildup',
    });
    expect(r).toMatchObject({ kind: 'measurement', measure: 'governor_cutout', value: 125, unit: 'psi' });
  });
  it('at the build-up step a bare "one twenty five" is a time', () => {
    expect(matchUtterance('one twenty five', { zone: 'air_brake_tests', measure: 'air_buildup' })).toMatchObject({
      measure: 'air_buildup',
      value: 85,
      unit: 's',
    });
  });
});
