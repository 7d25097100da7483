import { describe, expect, it } from 'vitest';
import {
  collapseRepeats,
  countWords,
  formatLimitText,
  formatQuantity,
  joinName,
  nameFinding,
  nameReading,
  rawIdPattern,
  sourceWords,
  statusWords,
  tidyText,
} from './name-finding';

describe('naming findings and readings', () => {
  it('says each word once where component, check and condition overlap', () => {
    expect(joinName(['steer tire', 'tire pressure'])).toBe('steer tire pressure');
    expect(joinName(['rear impact guard', 'rear impact guard'])).toBe('rear impact guard');
    expect(joinName(['air system', 'air buildup'])).toBe('air buildup');
    expect(joinName(['rear impact guard', 'ground clearance'])).toBe('rear impact guard ground clearance');
    expect(joinName(['steer_tire', 'tread_depth'])).toBe('steer tire tread depth');
  });

  it('names a finding from component, position and condition', () => {
    expect(nameFinding({ component: 'steer tire', condition: 'bulge', position: 'left' })).toBe(
      'left steer tire: bulge',
    );
    expect(nameFinding({ component: 'brake chamber', condition: 'audible air leak', position: 'axle 2' })).toBe(
      'brake chamber, axle 2: audible air leak',
    );
    expect(nameFinding({ component: 'steer tire', condition: 'tire pressure fails the limit' })).toBe(
      'steer tire pressure fails the limit',
    );
    expect(nameFinding({ component: 'air system', condition: 'air buildup fails the limit' })).toBe(
      'air buildup fails the limit',
    );
    expect(nameFinding({ component: 'steer_tire', condition: 'bulge' })).toBe('steer tire: bulge');
  });

  it('names a reading with its value and limit in words', () => {
    expect(
      nameReading({ component: 'steer tire', check: 'tire_pressure', value: 88, unit: 'psi', limitText: '100 psi' }),
    ).toBe('steer tire pressure: 88 psi (limit 100 psi)');
    expect(
      nameReading({ component: 'steer tire', check: 'tread_depth', value: 3, unit: '32nds', limitText: '4 32nds' }),
    ).toBe('steer tire tread depth: 3/32 in (limit 4/32 in)');
    expect(nameReading({ component: 'air system', check: 'air buildup', value: 62, unit: 's' })).toBe(
      'air buildup: 62 s',
    );
  });

  it('writes quantities and limits in words, never "32nds"', () => {
    expect(formatQuantity(4, '32nds')).toBe('4/32 in');
    expect(formatQuantity(1.375, 'in')).toBe('1.375 in');
    expect(formatLimitText('4 32nds')).toBe('4/32 in');
    expect(formatLimitText(null)).toBe('—');
  });

  it('plurals through Intl.PluralRules', () => {
    expect(countWords(1, 'defect')).toBe('1 defect');
    expect(countWords(0, 'defect')).toBe('0 defects');
    expect(countWords(3, 'major defect')).toBe('3 major defects');
  });

  it('shows a source as its regulation or "common practice", never an internal marker', () => {
    expect(sourceWords('49 CFR 393.47(e) (from memory, unverified)')).toBe('49 CFR 393.47(e)');
    expect(sourceWords('49 CFR 393.209(b) (partly verified)')).toBe('49 CFR 393.209(b)');
    expect(sourceWords('common practice, no published source')).toBe('common practice');
    expect(sourceWords('fleet setting; published: 49 CFR 393.75(b) (from memory, unverified)')).toBe(
      'fleet setting (published: 49 CFR 393.75(b))',
    );
  });

  it('turns stored codes into words', () => {
    expect(statusWords('unit.in_service')).toBe('in service');
    expect(tidyText('steer_tire:bulge')).toBe('steer tire, bulge');
    expect(tidyText('tread 4 32nds')).toBe('tread 4/32 in');
    expect(tidyText('steer tire tire pressure: 88 psi')).toBe('steer tire pressure: 88 psi');
    expect(collapseRepeats('rear impact guard rear impact guard')).toBe('rear impact guard');
    expect(collapseRepeats('axle 2 2')).toBe('axle 2 2');
    for (const t of ['steer_tire:bulge', '4 32nds', 'unit.in_service', '(from memory, unverified)'])
      expect(t).toMatch(rawIdPattern);
    expect('left steer tire: bulge, 4/32 in, in service').not.toMatch(rawIdPattern);
  });
});
