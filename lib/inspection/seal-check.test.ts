import { describe, expect, it } from 'vitest';
import { compareSeal, readSpokenSeal } from './seal-check';

describe('seal number by voice', () => {
  it('reads digits said one by one, with "oh" and "double"', () => {
    expect(readSpokenSeal('four seven oh double one nine')).toBe('470119');
    expect(readSpokenSeal('4 7 0 1 1 9')).toBe('470119');
    expect(readSpokenSeal('niner ate tree')).toBe('983');
  });
  it('finds the digits that differ', () => {
    expect(compareSeal('4701193', '4701193')).toMatchObject({ matches: true, wrongPositions: [] });
    expect(compareSeal('4701193', '4707193')).toMatchObject({ matches: false, wrongPositions: [4] });
    expect(compareSeal('4701193', '470119')).toMatchObject({ matches: false, wrongPositions: [7] });
  });
});
