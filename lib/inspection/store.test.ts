import { describe, expect, it } from 'vitest';
import { createWalkStore } from './store';

const zones = [
  { id: 'front', name: 'front', items: [] },
  { id: 'rear', name: 'rear', items: [] },
];
let n = 0;
const make = () =>
  createWalkStore({
    inspectionId: 'i1',
    zones,
    persistOnDevice: false,
    newId: () => `id-${n++}`,
    now: () => new Date('2026-12-01T05:00:00Z'),
  });

describe('walk store', () => {
  it('numbers steps in the order they happen', () => {
    const s = make();
    const a = s.getState().record({
      zone: 'front',
      item: null,
      kind: 'visit',
      heard: null,
      alternatives: [],
      inputMode: 'tap',
      termKey: null,
      position: null,
      score: null,
      resolution: null,
      undoesStepId: null,
      reading: null,
      notCheckedReason: null,
      note: null,
    });
    const b = s.getState().record({
      zone: 'front',
      item: null,
      kind: 'zone_ok',
      heard: 'all good',
      alternatives: [],
      inputMode: 'voice',
      termKey: null,
      position: null,
      score: 1,
      resolution: 'auto',
      undoesStepId: null,
      reading: null,
      notCheckedReason: null,
      note: null,
    });
    expect([a.seq, b.seq]).toEqual([0, 1]);
    expect(s.getState().steps.map((x) => x.id)).toEqual([a.id, b.id]);
    expect(a.deviceAt).toBe('2026-12-01T05:00:00.000Z');
  });

  it('merges steps from the server without doubling them', () => {
    const s = make();
    const a = s.getState().record({
      zone: 'front',
      item: null,
      kind: 'visit',
      heard: null,
      alternatives: [],
      inputMode: 'tap',
      termKey: null,
      position: null,
      score: null,
      resolution: null,
      undoesStepId: null,
      reading: null,
      notCheckedReason: null,
      note: null,
    });
    s.getState().adoptServerSteps([a, { ...a, id: 'server-only', seq: 5 }]);
    expect(s.getState().steps.map((x) => x.id)).toEqual([a.id, 'server-only']);
    expect(s.getState().nextSeq).toBe(6);
  });

  it('keeps the zone index inside the walk', () => {
    const s = make();
    s.getState().moveToZone(9);
    expect(s.getState().zoneIndex).toBe(1);
    s.getState().moveToZone(-3);
    expect(s.getState().zoneIndex).toBe(0);
  });

  it('takes the server’s verdict on a reading and keeps what the phone had said', () => {
    const s = make();
    const reading = s.getState().record({
      zone: 'front',
      item: 'front.steer_pressure',
      kind: 'measurement',
      heard: null,
      alternatives: [],
      inputMode: 'typed',
      termKey: null,
      position: null,
      score: null,
      resolution: null,
      undoesStepId: null,
      reading: { value: 107 },
      notCheckedReason: null,
      note: null,
      verdict: 'pass',
      severity: null,
    });
    s.getState().adoptServerVerdict(reading.id, { verdict: 'pass', severity: null });
    expect(s.getState().steps[0]!.phoneVerdict).toBeUndefined();
    s.getState().adoptServerVerdict(reading.id, { verdict: 'fail', severity: 'minor', limit: '110 psi' });
    expect(s.getState().steps[0]).toMatchObject({
      verdict: 'fail',
      severity: 'minor',
      limit: '110 psi',
      phoneVerdict: { verdict: 'pass', severity: null },
    });
  });
});
