import { describe, expect, it } from 'vitest';
import zonesGrammar from '@/grammars/zones.json' with { type: 'json' };
import vocabularyFile from '@/grammars/vocabulary.json' with { type: 'json' };
import { matchUtterance } from '@/lib/matcher';
import type { Vocabulary, ZoneItem, Zones } from '@/lib/schemas/grammar';
import {
  applyUtterance,
  isBareAcknowledgement,
  readBackFinding,
  type StepDraft,
  type WalkContext,
} from './apply-utterance';
import type { CheckContext } from './check-input';
import { DEFAULT_REQUIRED_READINGS, isRequiredItem, listWalkZones } from './zones';

const zones = listWalkZones(zonesGrammar as Zones, { kind: 'pre_trip', configuration: 'tractor_trailer' });
const vocabulary = vocabularyFile as unknown as Vocabulary;
const checkContext: CheckContext = {
  tractorAxles: [
    { position: 'steer', tires: ['LF', 'RF'], coldPsi: 110, chamber: '24' },
    { position: 'drive', tires: ['LFO', 'LFI', 'RFI', 'RFO'], coldPsi: 100, chamber: '30' },
  ],
  trailerAxles: [],
  hasTrailer: true,
  trailerYear: 2021,
  fleetTargets: { steer: 110, drive: 100, trailer: 100 },
};

let seq = 0;
const asSteps = (drafts: StepDraft[]) => drafts.map((d) => ({ ...d, id: `s${seq}`, seq: seq++ }));

function walkIn(zoneId: string, before: StepDraft[] = [], pending: WalkContext['pending'] = null) {
  const ctx = {
    zones,
    zoneIndex: zones.findIndex((z) => z.id === zoneId),
    steps: asSteps(before),
    pending,
    vocabulary,
    profile: 'us-federal',
    checkContext,
    isRequired: (i: ZoneItem) => isRequiredItem(i, { kind: 'pre_trip', requiredReadings: DEFAULT_REQUIRED_READINGS }),
  };
  const say = (text: string) =>
    applyUtterance(ctx, matchUtterance(text, { zone: zoneId }), { alternatives: [text], inputMode: 'voice' });
  return { ctx, say };
}

describe('applyUtterance: a table of utterances in context', () => {
  // [zone, what was said before, what is said now, kinds recorded, moves on?]
  const table: [string, string[], string, string[], boolean][] = [
    ['front', [], 'all good here', ['zone_ok'], true],
    ['front', [], 'front is good', ['zone_ok'], true],
    ['front', [], 'all good', ['zone_ok'], true],
    ['front', [], 'ok', [], false],
    ['front', [], 'good', [], false],
    ['front', [], 'fine', [], false],
    ['front', [], 'pass', [], false],
    ['front', ['bulge on the left steer tire'], 'ok', [], false],
    ['front', [], 'bulge on the left steer tire', ['defect'], false],
    ['front', [], 'steer tread five thirty seconds', ['measurement'], false],
    ['front', [], 'next', [], true],
    ['engine_bay', [], "where's my coffee", ['note'], false],
    // Required air-brake readings still open: "all good" answers the visual items but stays.
    ['air_brake_tests', [], 'all good here', ['zone_ok'], false],
  ];
  it.each(table)('in %s, after %j, "%s" records %j (moves on: %s)', (zoneId, before, text, kinds, moves) => {
    let w = walkIn(zoneId);
    const earlier: StepDraft[] = [];
    for (const b of before) {
      const out = w.say(b);
      earlier.push(...out.record);
      w = walkIn(zoneId, earlier);
    }
    const out = w.say(text);
    expect(out.record.map((s) => s.kind)).toEqual(kinds);
    expect(out.moveTo !== undefined && out.moveTo !== w.ctx.zoneIndex).toBe(moves);
  });

  it('a bare "ok" after a read-back says how to close the zone and records nothing', () => {
    const first = walkIn('front').say('bulge on the left steer tire');
    expect(first.say).toBe('Left steer tire, bulge. Major: out of service.');
    const out = walkIn('front', first.record).say('okay');
    expect(out.record).toEqual([]);
    expect(out.moveTo).toBeUndefined();
    expect(out.show).toMatch(/all good here/);
  });

  it('a bare "ok" answers a waiting "did you mean"', () => {
    const asked = walkIn('coupling').say('glad hand seal leaking');
    expect(asked.pending).toBeTruthy();
    const out = walkIn('coupling', [], asked.pending).say('ok');
    expect(out.record.map((s) => [s.kind, s.resolution])).toEqual([['defect', 'confirmed']]);
    expect(out.moveTo).toBeUndefined();
  });

  it('"no" to a "did you mean" keeps it for a pick', () => {
    const asked = walkIn('coupling').say('glad hand seal leaking');
    const out = walkIn('coupling', [], asked.pending).say('no');
    expect(out.declinePending).toBe(true);
    expect(out.record).toEqual([]);
  });

  it('"all good here" never answers an item that needs a reading', () => {
    const out = walkIn('air_brake_tests').say('all good here');
    expect(out.say).toMatch(/Still to read: .*governor/);
  });

  it('a leakage reading goes to the applied or released test as said', () => {
    const applied = walkIn('air_brake_tests').say('lost five psi in a minute with the brakes applied');
    expect(applied.record[0]).toMatchObject({ kind: 'measurement', item: 'air.applied_leak', reading: { value: 5 } });
    // CDL manual §5.3: a combination may lose at most 4 psi in a minute with the brakes applied
    expect(applied.record[0]).toMatchObject({ verdict: 'fail' });
    const released = walkIn('air_brake_tests').say('brakes released lost two psi');
    expect(released.record[0]).toMatchObject({ item: 'air.static_leak', verdict: 'pass' });
  });

  it('a reading with no item of its kind in the zone is said so', () => {
    const out = walkIn('engine_bay').say('ninety five psi');
    expect(out.record).toEqual([]);
    expect(out.say).toBe('No reading of that kind here.');
  });

  it('a steer tread of 3/32 is a major defect, 49 CFR 393.75(b)', () => {
    const out = walkIn('front').say('steer tread three thirty seconds');
    expect(out.record[0]).toMatchObject({ item: 'front.steer_tread', verdict: 'fail', severity: 'major' });
  });
});

describe('the words', () => {
  it('tells bare acknowledgements from zone-level phrases', () => {
    for (const bare of ['ok', 'okay', 'good', 'looks good', 'fine', 'pass', 'it is good', 'all right'])
      expect(isBareAcknowledgement(bare), bare).toBe(true);
    for (const zone of ['all good here', 'all good', 'front is good', 'everything looks good', 'no defects'])
      expect(isBareAcknowledgement(zone), zone).toBe(false);
  });
  it('reads a finding back in a few words', () => {
    expect(readBackFinding({ component: 'steer tire', condition: 'bulge', position: 'left', severity: 'major' })).toBe(
      'Left steer tire, bulge. Major: out of service.',
    );
  });
  it('an unsure finding comes with choices from the zone', () => {
    const asked = walkIn('coupling').say('glad hand seal leaking');
    expect(asked.pending?.others.map((a) => a.termId)).toContain('glad_hand:audible_air_leak');
  });
});
