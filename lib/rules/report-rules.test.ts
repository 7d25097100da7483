import { describe, expect, it } from 'vitest';
import {
  DEFAULT_MINIMUM_PRETRIP_MINUTES,
  checkInspectionCompleteness,
  checkInspectionDuration,
  getReportValidity,
  getUnitServiceStatus,
  listDefectsToAcknowledge,
} from './index';
import type { DefectRecord } from './index';

const certified = { outcome: 'repaired' as const, certifiedAt: '2026-03-02T08:00:00Z', certifiedBy: 'mechanic-1' };

describe('unit out of service', () => {
  // 49 CFR 396.11(a)(3) / NSC 13: a major defect keeps the unit off the road until repaired and certified.
  it('is out of service while any major defect on the unit is open', () => {
    const defects: DefectRecord[] = [
      { id: 'd1', unitId: 'T1', severity: 'major' },
      { id: 'd2', unitId: 'T1', severity: 'minor' },
      { id: 'd3', unitId: 'TR9', severity: 'major', repair: certified },
    ];
    expect(getUnitServiceStatus('T1', defects)).toMatchObject({ outOfService: true });
    expect(getUnitServiceStatus('T1', defects).openMinor.map((d) => d.id)).toEqual(['d2']);
    expect(getUnitServiceStatus('TR9', defects).outOfService).toBe(false);
    expect(
      getUnitServiceStatus('T1', [
        { id: 'd1', unitId: 'T1', severity: 'major', repair: { outcome: 'repair_unnecessary', certifiedAt: 0 } },
      ]).outOfService,
    ).toBe(false);
    expect(getUnitServiceStatus('T1', [{ id: 'd2', unitId: 'T1', severity: 'minor' }]).outOfService).toBe(false);
  });
});

describe('inspection completeness', () => {
  it('is complete only when every zone was visited and every required item answered', () => {
    const zones = [
      { id: 'front', visited: true, items: [{ id: 'headlamps', required: true, answer: 'ok' as const }] },
      {
        id: 'coupling',
        visited: true,
        items: [
          { id: 'jaws', required: true, answer: null },
          { id: 'extra', required: false, answer: null },
        ],
      },
      { id: 'rear', visited: false, items: [] },
    ];
    expect(checkInspectionCompleteness(zones)).toEqual({
      complete: false,
      unvisitedZones: ['rear'],
      unansweredItems: [{ zoneId: 'coupling', itemId: 'jaws' }],
    });
    const done = zones.map((zone) => ({
      ...zone,
      visited: true,
      items: zone.items.map((item) => (item.required ? { ...item, answer: 'defect' as const } : item)),
    }));
    expect(checkInspectionCompleteness(done).complete).toBe(true);
  });
});

describe('inspection duration', () => {
  // No FMCSR minimum; 15 minutes is common practice, no published source.
  it('compares with 15 minutes by default and with the fleet minimum when set', () => {
    expect(DEFAULT_MINIMUM_PRETRIP_MINUTES).toBe(15);
    const start = '2026-03-02T05:00:00Z';
    expect(checkInspectionDuration(start, '2026-03-02T05:14:59Z')).toMatchObject({ short: true, minimumMinutes: 15 });
    expect(checkInspectionDuration(start, '2026-03-02T05:15:00Z')).toMatchObject({ short: false, minutes: 15 });
    expect(checkInspectionDuration(start, '2026-03-02T05:15:00Z').source).toMatch(/common practice/);
    expect(checkInspectionDuration(start, '2026-03-02T05:18:00Z', { minimumPretripMinutes: 20 })).toMatchObject({
      short: true,
      minimumMinutes: 20,
    });
    expect(
      checkInspectionDuration(Date.parse(start), new Date('2026-03-02T05:25:00Z'), { minimumPretripMinutes: 20 }).short,
    ).toBe(false);
  });
});

describe('report validity', () => {
  // NSC 13 trip inspection: report valid for 24 hours from the inspection time.
  it('Canadian report is valid for 24 hours', () => {
    const at = Date.parse('2026-03-02T05:00:00Z');
    const day = 24 * 3600 * 1000;
    expect(getReportValidity('ca', at, at + day - 1)).toMatchObject({ valid: true, validUntil: at + day });
    expect(getReportValidity('ca', at, at + day).valid).toBe(false);
  });
  // 49 CFR 396.11 / 396.13: no fixed validity period in the US.
  it('US report has no fixed validity period', () => {
    expect(getReportValidity('us', 0, 10 * 24 * 3600 * 1000)).toMatchObject({ valid: true, validUntil: null });
  });
});

describe('defects the next driver must acknowledge (49 CFR 396.13)', () => {
  const previous = {
    id: 'r1',
    unitIds: ['T1', 'TR9'],
    defects: [
      { id: 'd1', unitId: 'T1', severity: 'minor' as const, repair: certified },
      { id: 'd2', unitId: 'TR9', severity: 'major' as const },
      { id: 'd3', unitId: 'T1', severity: 'minor' as const },
    ],
  };
  it('lists defects on units still in the combination; a dropped trailer needs no signature', () => {
    const due = listDefectsToAcknowledge(previous, ['T1', 'TR4']);
    expect(due.mustAcknowledge.map((d) => d.id)).toEqual(['d1', 'd3']);
    expect(due.signatureRequired).toBe(true);
    // FMCSA guidance to 396.13, Q1: uncertified defects → do not operate.
    expect(due.uncertified.map((d) => d.id)).toEqual(['d3']);
    expect(due.mayOperate).toBe(false);
  });
  it('Canadian profile: an open minor defect does not stop the unit, an open major does', () => {
    expect(listDefectsToAcknowledge(previous, ['T1'], 'ca').mayOperate).toBe(true);
    expect(listDefectsToAcknowledge(previous, ['T1', 'TR9'], 'ca').mayOperate).toBe(false);
  });
  it('nothing to sign without a previous report or defects', () => {
    expect(listDefectsToAcknowledge(null, ['T1'])).toMatchObject({ signatureRequired: false, mayOperate: true });
    expect(listDefectsToAcknowledge({ id: 'r0', unitIds: ['T1'], defects: [] }, ['T1']).signatureRequired).toBe(false);
  });
});
