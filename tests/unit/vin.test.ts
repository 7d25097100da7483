// The VIN check digit of 49 CFR 565.15: transliterated characters times position weights, sum
// modulo 11, a remainder of 10 written X.
import { describe, expect, it } from 'vitest';
import { demoTractors, demoTrailers, demoVin } from '../../db/seeds/01-demo-fleet';
import { computeVinCheckDigit, findVinProblem } from '../../lib/schemas/units';

describe('VIN check digit (49 CFR 565.15)', () => {
  it('the worked example 1M8GDM9A_KP042788: products sum to 351, remainder 10, check digit X', () => {
    // Worked example published with the check-digit method (transliteration table and weights
    // 8 7 6 5 4 3 2 10 0 9 8 7 6 5 4 3 2), e.g. on the Wikipedia page "Vehicle identification number".
    expect(computeVinCheckDigit('1M8GDM9A0KP042788')).toBe('X');
    expect(findVinProblem('1M8GDM9AXKP042788')).toBeNull();
  });

  it('a second published example, 1G1BL52P7TR115520: sum 337, remainder 7', () => {
    expect(computeVinCheckDigit('1G1BL52P0TR115520')).toBe('7');
    expect(findVinProblem('1G1BL52P7TR115520')).toBeNull();
    expect(findVinProblem('1G1BL52P8TR115520')).toMatch(/check digit/);
  });

  it('every demo unit carries a well-formed VIN whose 10th character is its model year', () => {
    const yearCode: Record<number, string> = {
      2014: 'E',
      2016: 'G',
      2017: 'H',
      2019: 'K',
      2020: 'L',
      2021: 'M',
      2022: 'N',
      2023: 'P',
      2024: 'R',
    };
    const units = [...demoTractors, ...demoTrailers];
    expect(units.length).toBeGreaterThan(10);
    for (const u of units) {
      expect(findVinProblem(u.vin), `${u.unitNumber} ${u.vin}`).toBeNull();
      expect(u.vin[9], `${u.unitNumber} model year`).toBe(yearCode[u.year]);
    }
    expect(new Set(units.map((u) => u.vin)).size).toBe(units.length);
    expect(findVinProblem(demoVin('1AR6L4TX', 2018, 98_765))).toBeNull();
  });
});
