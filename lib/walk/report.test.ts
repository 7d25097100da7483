import { describe, expect, it } from 'vitest';
import { certificationStatement, hashReport, REPORT_FORMAT, type ReportEvidence } from './report';
import { sha256Hex } from './sha256';

const header = {
  id: '00000000-0000-4000-8000-000000000001',
  fleetId: '00000000-0000-4000-8000-0000000000f1',
  kind: 'pre_trip',
  driverId: '00000000-0000-4000-8000-0000000000d1',
  tractorId: '00000000-0000-4000-8000-0000000000a1',
  trailerId: null,
  odometer: 412880,
  location: 'yard B',
  billOfLading: null,
  sealNumber: null,
  ruleProfile: 'us-federal',
  vocabularyVersionId: null,
  startedAt: '2026-12-01T06:00:00.000Z',
  finishedAt: '2026-12-01T06:21:00.000Z',
  certificationText: certificationStatement,
  signatureName: 'Luis Ferreira',
  signedAt: '2026-12-01T06:22:00.000Z',
};
const step = (over: Partial<Record<string, unknown>> = {}) => ({
  id: '00000000-0000-4000-8000-000000000011',
  seq: 0,
  zone: 'front',
  item: 'front.steer_tread',
  kind: 'measurement',
  heard: 'steer tread six',
  termKey: null,
  component: 'steer tire',
  condition: null,
  position: null,
  score: 0.95,
  resolution: 'auto',
  undoesStepId: null,
  measurementKind: 'tread_depth',
  value: 6,
  unit: '32nds',
  verdict: 'pass',
  severity: null,
  deviceAt: '2026-12-01T06:01:00.000Z',
  serverAt: '2026-12-01T06:01:00.400Z',
  notCheckedReason: null,
  note: null,
  ...over,
});
const evidence: ReportEvidence = {
  photos: [{ id: '00000000-0000-4000-8000-0000000000a1', stepId: null, sha256: sha256Hex('photo bytes') }],
  signatureSha256: sha256Hex('signature png'),
};
const base = hashReport(header, [step()], evidence);

describe('sha256Hex', () => {
  it('matches the FIPS 180-4 test vectors', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
  });
});

describe('hashReport', () => {
  it('is the same for the same record, whatever the order rows arrive in', () => {
    const second = step({ id: '00000000-0000-4000-8000-000000000012', seq: 1, kind: 'zone_ok', item: null });
    expect(hashReport(header, [step(), second], evidence)).toBe(hashReport(header, [second, step()], evidence));
  });
  it.each([
    ['a step’s value', { value: 7 }],
    ['a step’s verdict', { verdict: 'fail' }],
    ['a step’s server time', { serverAt: '2026-12-01T06:01:09.000Z' }],
    ['a not-checked reason', { notCheckedReason: 'no_gauge' }],
  ])('changes when %s changes', (_what, over) => {
    expect(hashReport(header, [step(over)], evidence)).not.toBe(base);
  });
  it('changes when a step is added or removed', () => {
    expect(hashReport(header, [], evidence)).not.toBe(base);
    expect(
      hashReport(header, [step(), step({ id: '00000000-0000-4000-8000-000000000013', seq: 2 })], evidence),
    ).not.toBe(base);
  });
  it('changes when a photo is added, removed or its bytes change', () => {
    const extra = { id: '00000000-0000-4000-8000-0000000000b2', stepId: null, sha256: sha256Hex('another') };
    expect(hashReport(header, [step()], { ...evidence, photos: [...evidence.photos, extra] })).not.toBe(base);
    expect(hashReport(header, [step()], { ...evidence, photos: [] })).not.toBe(base);
    expect(
      hashReport(header, [step()], { ...evidence, photos: [{ ...evidence.photos[0]!, sha256: sha256Hex('edited') }] }),
    ).not.toBe(base);
  });
  it('changes when the signature image changes or is removed', () => {
    expect(hashReport(header, [step()], { ...evidence, signatureSha256: sha256Hex('other ink') })).not.toBe(base);
    expect(hashReport(header, [step()], { ...evidence, signatureSha256: null })).not.toBe(base);
  });
  it('changes when the header changes', () => {
    expect(hashReport({ ...header, signatureName: 'Wren Castillo' }, [step()], evidence)).not.toBe(base);
  });
  it('format 1 (older reports) covers neither photos nor signature', () => {
    const v1 = hashReport(header, [step()], evidence, 1);
    expect(hashReport(header, [step()], { photos: [], signatureSha256: null }, 1)).toBe(v1);
    expect(REPORT_FORMAT).toBe(2);
  });
});
