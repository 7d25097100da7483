import { describe, expect, it } from 'vitest';
import zonesGrammar from '@/grammars/zones.json' with { type: 'json' };
import type { Zones } from '@/lib/schemas/grammar';
import { DEFAULT_REQUIRED_READINGS, isRequiredItem, listWalkZones, zoneName } from './zones';

const zones = zonesGrammar as Zones;
const ids = (kind: 'pre_trip' | 'post_trip', configuration: 'tractor_trailer' | 'bobtail') =>
  listWalkZones(zones, { kind, configuration }).map((z) => z.id);

describe('listWalkZones', () => {
  it('a tractor-trailer pre-trip walks all ten zones, ending with the air-brake tests', () => {
    expect(ids('pre_trip', 'tractor_trailer')).toEqual([
      'front',
      'engine_bay',
      'driver_side_tractor',
      'coupling',
      'driver_side_trailer',
      'rear',
      'passenger_side_trailer',
      'passenger_side_tractor',
      'in_cab',
      'air_brake_tests',
    ]);
  });
  it('a bobtail has no coupling and no trailer sides', () => {
    expect(ids('pre_trip', 'bobtail')).toEqual([
      'front',
      'engine_bay',
      'driver_side_tractor',
      'rear',
      'passenger_side_tractor',
      'in_cab',
      'air_brake_tests',
    ]);
  });
  it('a post-trip has no air-brake tests, with or without a trailer', () => {
    expect(ids('post_trip', 'tractor_trailer')).not.toContain('air_brake_tests');
    expect(ids('post_trip', 'tractor_trailer')).toHaveLength(9);
    expect(ids('post_trip', 'bobtail')).toEqual([
      'front',
      'engine_bay',
      'driver_side_tractor',
      'rear',
      'passenger_side_tractor',
      'in_cab',
    ]);
  });
  it('items follow the configuration: a bobtail rear has no doors, seal or cargo', () => {
    const rear = listWalkZones(zones, { kind: 'pre_trip', configuration: 'bobtail' }).find((z) => z.id === 'rear')!;
    expect(rear.items.map((i) => i.id)).not.toContain('rear.doors');
    expect(rear.items.map((i) => i.id)).not.toContain('rear.seal');
    const trailerRear = listWalkZones(zones, { kind: 'pre_trip', configuration: 'tractor_trailer' }).find(
      (z) => z.id === 'rear',
    )!;
    expect(trailerRear.items.map((i) => i.id)).toContain('rear.seal');
  });
  it('the bobtail air-brake zone has no tractor-protection test', () => {
    const air = listWalkZones(zones, { kind: 'pre_trip', configuration: 'bobtail' }).at(-1)!;
    expect(air.items.map((i) => i.id)).not.toContain('air.tractor_protection');
  });
  it('names a zone from the grammar, an unknown one in words', () => {
    expect(zoneName(zones, 'air_brake_tests')).toBe('air-brake tests');
    expect(zoneName(zones, 'roof_box')).toBe('roof box');
  });
});

describe('isRequiredItem', () => {
  const rules = { kind: 'pre_trip' as const, requiredReadings: DEFAULT_REQUIRED_READINGS };
  it('every visual item is required', () => {
    expect(isRequiredItem({}, rules)).toBe(true);
  });
  it('by default a pre-trip requires the air-brake readings, not tread or pressure', () => {
    expect(isRequiredItem({ measure: 'air_leak' }, rules)).toBe(true);
    expect(isRequiredItem({ measure: 'low_air_warning' }, rules)).toBe(true);
    expect(isRequiredItem({ measure: 'tread_depth' }, rules)).toBe(false);
    expect(isRequiredItem({ measure: 'tire_pressure' }, rules)).toBe(false);
  });
  it('a fleet can require tread depth; a post-trip requires no reading', () => {
    expect(isRequiredItem({ measure: 'tread_depth' }, { ...rules, requiredReadings: ['tread_depth'] })).toBe(true);
    expect(isRequiredItem({ measure: 'air_leak' }, { ...rules, kind: 'post_trip' })).toBe(false);
  });
});
