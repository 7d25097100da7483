import { describe, expect, it } from 'vitest';
import type { QueuedRequest } from './flush-queue';
import { maxResendRounds, planResend } from './resend-missing';
import type { WalkStep } from './store';

const step = (id: string, seq: number): WalkStep => ({
  id,
  seq,
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
  deviceAt: '2026-12-02T05:00:00.000Z',
});
const finishUrl = '/api/inspections/i1/finish';
const refusedFinish = (missing: string[], stepIds: string[], round?: number): QueuedRequest => ({
  key: '9',
  label: 'signature',
  url: finishUrl,
  method: 'POST',
  json: { signatureName: 'A Driver', certify: true, finishedAt: '2026-12-02T05:30:00.000Z', stepIds },
  state: 'failed',
  error: 'missing',
  errorFields: { stepIds: missing },
  attempts: 1,
  ...(round ? { resendRound: round } : {}),
});
const steps = [step('a', 0), step('b', 1), step('c', 2)];

describe('planResend', () => {
  it('sends the missing steps again, in walk order, then the same signature', () => {
    const plan = planResend({ outbox: [refusedFinish(['c', 'a'], ['a', 'b', 'c'])], steps, finishUrl });
    expect(plan?.steps.map((s) => s.id)).toEqual(['a', 'c']);
    expect(plan?.finishJson).toMatchObject({ signatureName: 'A Driver', certify: true, stepIds: ['a', 'b', 'c'] });
    expect(plan).toMatchObject({ dropKey: '9', round: 1 });
  });

  it('stops naming a step the server refused for good, and does not send it again', () => {
    const refusedStep: QueuedRequest = {
      key: '5',
      label: 'ok',
      url: '/api/inspections/i1/steps',
      method: 'POST',
      json: { id: 'b' },
      state: 'failed',
      error: 'not in the vocabulary',
      attempts: 1,
    };
    const plan = planResend({ outbox: [refusedStep, refusedFinish(['b'], ['a', 'b', 'c'])], steps, finishUrl });
    expect(plan?.steps).toEqual([]);
    expect(plan?.finishJson.stepIds).toEqual(['a', 'c']);
  });

  it('gives up after a few rounds, so that the driver sees the refusal', () => {
    expect(planResend({ outbox: [refusedFinish(['a'], ['a'], maxResendRounds)], steps, finishUrl })).toBeNull();
  });

  it('leaves alone a signature refused for another reason, or nothing at all', () => {
    const other: QueuedRequest = { ...refusedFinish([], ['a']), errorFields: { signatureName: ['Type A Driver.'] } };
    expect(planResend({ outbox: [other], steps, finishUrl })).toBeNull();
    expect(planResend({ outbox: [], steps, finishUrl })).toBeNull();
  });

  it('makes no plan that would change nothing', () => {
    // The server says "a" is missing, but the phone no longer holds it and it is not named: nothing to do.
    expect(planResend({ outbox: [refusedFinish(['a'], ['b'])], steps: [step('b', 1)], finishUrl })).toBeNull();
  });
});
