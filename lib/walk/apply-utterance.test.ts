import { describe, expect, it } from 'vitest';
import { listWalkZones, matchUtterance } from '@/lib/matcher';
import zones from '@/grammars/zones.json' with { type: 'json' };
import type { Zones } from '@/lib/schemas/grammar';
import { decideFromMatch, readBackFinding } from './interpret';

const walk = listWalkZones(zones as Zones, 'tractor_trailer');
const zone = (id: string) => walk.find((z) => z.id === id)!;
const decide = (text: string, zoneId: string, answered: string[] = []) =>
  decideFromMatch(
    matchUtterance(text, { zone: zoneId }),
    zone(zoneId),
    new Map(answered.map((a) => [a, 'ok' as const])),
  );

describe('decideFromMatch', () => {
  it('"all good" answers the zone', () => {
    expect(decide('all good', 'front')).toEqual({ do: 'zone_ok' });
  });
  it('commands pass through', () => {
    expect(decide('next', 'front')).toEqual({ do: 'command', command: 'next' });
    expect(decide('undo that', 'front')).toEqual({ do: 'command', command: 'undo' });
  });
  it('a reading goes to the zone item that takes it', () => {
    expect(decide('steer tread five thirty seconds', 'front')).toEqual({
      do: 'reading',
      itemId: 'front.steer_tread',
      value: 5,
    });
    expect(decide('one hundred and five psi', 'front')).toEqual({
      do: 'reading',
      itemId: 'front.steer_pressure',
      value: 105,
    });
  });
  it('a leakage reading goes to the applied or released test as said', () => {
    expect(decide('lost five psi in a minute with the brakes applied', 'air_brake_tests')).toMatchObject({
      do: 'reading',
      itemId: 'air.applied_leak',
      value: 5,
    });
    expect(decide('brakes released lost two psi', 'air_brake_tests')).toMatchObject({
      do: 'reading',
      itemId: 'air.static_leak',
      value: 2,
    });
  });
  it('a reading with no item of its kind in the zone is said so', () => {
    expect(decide('ninety five psi', 'engine_bay')).toEqual({ do: 'no_reading_here', measure: 'tire_pressure' });
  });
  it('a finding carries its term, position and the item it answers', () => {
    const d = decide('bulge on the left steer tire', 'front');
    expect(d).toMatchObject({
      do: 'finding',
      termKey: 'steer_tire:bulge',
      position: 'left',
      severity: 'major',
      itemId: 'front.steer_tires',
    });
  });
  it('an unsure finding comes with choices from the zone', () => {
    const d = decide('glad hand seal leaking', 'coupling');
    expect(d).toMatchObject({ do: 'finding', needsConfirmation: true });
    if (d.do !== 'finding') throw new Error('not a finding');
    expect(d.alternatives.map((a) => a.termId)).toContain('glad_hand:audible_air_leak');
  });
  it('chatter is not understood', () => {
    expect(decide("where's my coffee", 'front')).toEqual({ do: 'not_understood' });
  });
  it('reads a finding back in a few words', () => {
    expect(readBackFinding({ component: 'steer tire', condition: 'bulge', position: 'left', severity: 'major' })).toBe(
      'Left steer tire, bulge. Major: out of service.',
    );
  });
});
