import { describe, expect, it } from 'vitest';
import zonesGrammar from '@/grammars/zones.json' with { type: 'json' };
import type { Zones } from '@/lib/schemas/grammar';
import { listOpenItems, mapItemAnswers } from './progress';
import { DEFAULT_REQUIRED_READINGS, listWalkZones } from './zones';

const rules = { kind: 'pre_trip' as const, requiredReadings: DEFAULT_REQUIRED_READINGS };
const zones = listWalkZones(zonesGrammar as Zones, { kind: 'pre_trip', configuration: 'bobtail' });
let n = 0;
const step = (zone: string, kind: string, item: string | null = null, extra = {}) => ({
  id: `s${n}`,
  seq: n++,
  zone,
  item,
  kind,
  termKey: null,
  undoesStepId: null,
  ...extra,
});

describe('answers and open items', () => {
  it('"zone OK" on every zone leaves the required readings open, never marks them OK', () => {
    const steps = zones.map((z) => step(z.id, 'zone_ok'));
    const answers = mapItemAnswers(zones, steps);
    expect(answers.get('front.headlights')).toBe('ok');
    expect(answers.has('front.steer_tread')).toBe(false);
    expect(answers.has('air.cutout')).toBe(false);
    const open = listOpenItems(zones, steps, rules);
    expect(open.map((o) => o.item)).toEqual([
      'air.buildup',
      'air.cutout',
      'air.cutin',
      'air.static_leak',
      'air.applied_leak',
      'air.low_air',
    ]);
    expect(open[0]).toMatchObject({ zone: 'air_brake_tests', zoneIndex: zones.length - 1, reading: true });
  });
  it('a reading or "not checked" with a reason closes a required reading; an undo opens it again', () => {
    const read = step('air_brake_tests', 'measurement', 'air.cutout', { verdict: 'pass' });
    const skipped = step('air_brake_tests', 'not_checked', 'air.buildup');
    const steps = [...zones.map((z) => step(z.id, 'zone_ok')), read, skipped];
    expect(mapItemAnswers(zones, steps).get('air.buildup')).toBe('not_checked');
    expect(listOpenItems(zones, steps, rules).map((o) => o.item)).not.toContain('air.cutout');
    const undone = [...steps, step('air_brake_tests', 'undo', null, { undoesStepId: read.id })];
    expect(listOpenItems(zones, undone, rules).map((o) => o.item)).toContain('air.cutout');
  });
  it('nothing answered: every visual item of every zone is open', () => {
    const visual = zones.flatMap((z) => z.items.filter((i) => !i.measure));
    expect(listOpenItems(zones, [], rules)).toHaveLength(visual.length + 6);
  });
  it('a post-trip requires no reading', () => {
    const post = listWalkZones(zonesGrammar as Zones, { kind: 'post_trip', configuration: 'bobtail' });
    const steps = post.map((z) => step(z.id, 'zone_ok'));
    expect(listOpenItems(post, steps, { ...rules, kind: 'post_trip' })).toEqual([]);
  });
});
