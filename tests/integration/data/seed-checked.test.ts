// The seeded history holds up to a practitioner: every reading is judged by lib/rules the way the
// seed says, and every defect sits on the unit that has the component.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateMeasurement, type EvaluationResult } from '@/lib/rules';
import { makeOfficeFleet, type OfficeFleet } from '../office/office-fixtures';

let f: OfficeFleet;
beforeAll(async () => {
  f = await makeOfficeFleet({ history: 45, name: 'Seed check fleet' });
}, 120_000);
afterAll(() => f.db.destroy());

/** The rule input a reading stands for, from its item and the walk it was part of. */
function inputFor(
  s: { item: string | null; zone: string; measurementKind: string | null; value: number | null },
  walk: { trailerId: string | null; trailerYear: number | null },
): Record<string, unknown> {
  const onTrailer = s.zone.includes('trailer');
  const value = Number(s.value);
  switch (s.measurementKind) {
    case 'tread_depth':
      return { check: 'tread_depth', position: s.zone === 'front' ? 'steer' : onTrailer ? 'trailer' : 'drive', value };
    case 'tire_pressure':
      return { check: 'tire_pressure', target: s.zone === 'front' ? 110 : 100, max_cold: 120, value };
    case 'pushrod_stroke':
      return { check: 'pushrod_stroke', chamber: onTrailer ? '30L' : '30', value };
    case 'steering_lash':
      return { check: 'steering_lash', wheel_diameter: 20, power: true, value };
    case 'air_buildup':
      return { check: 'air_buildup', from: 85, to: 100, seconds: value };
    case 'air_leak':
      // The item says which test it is: "leakage, brakes applied" (air.applied_leak) or released.
      return {
        check: 'air_leak',
        mode: s.item === 'air.applied_leak' ? 'applied' : 'released',
        combination: walk.trailerId !== null,
        value,
      };
    case 'rear_impact_guard':
      return { check: 'rear_impact_guard', ground_clearance: value, trailer_built_year: walk.trailerYear };
    default:
      return { check: s.measurementKind, value };
  }
}

describe('seeded history against lib/rules', () => {
  it('every seeded reading is judged by lib/rules as the seed claims', async () => {
    const rows = await f.db
      .selectFrom('inspectionStep as s')
      .innerJoin('inspection as i', 'i.id', 's.inspectionId')
      .leftJoin('unit as tr', 'tr.id', 'i.trailerId')
      .select(['s.item', 's.zone', 's.measurementKind', 's.value', 's.verdict', 's.severity', 's.limitText'])
      .select(['i.trailerId', 'tr.year as trailerYear'])
      .where('s.fleetId', '=', f.fleet.id)
      .where('s.kind', '=', 'measurement')
      .execute();
    expect(rows.length).toBeGreaterThan(200);
    const kinds = new Set(rows.map((r) => r.measurementKind));
    expect(kinds).toContain('air_leak');
    expect(kinds).toContain('rear_impact_guard');
    const wrong: string[] = [];
    for (const r of rows) {
      const v = evaluateMeasurement(
        inputFor(r, { trailerId: r.trailerId, trailerYear: r.trailerYear }),
      ) as EvaluationResult;
      const limitText = v.limit === null ? null : `${v.limit} ${v.unit}`;
      if (v.verdict !== r.verdict || (v.severity ?? null) !== r.severity || limitText !== r.limitText)
        wrong.push(
          `${r.item} ${r.value}: seed ${r.verdict}/${r.severity}/${r.limitText}, rules ${v.verdict}/${v.severity}/${limitText}`,
        );
    }
    expect([...new Set(wrong)].slice(0, 8)).toEqual([]);
  });

  it('both leakage tests are seeded, each with its own limit', async () => {
    const rows = await f.db
      .selectFrom('inspectionStep')
      .select(['item', 'limitText'])
      .distinct()
      .where('fleetId', '=', f.fleet.id)
      .where('measurementKind', '=', 'air_leak')
      .execute();
    // CDL manual §5.3: released, combination under 3 psi; applied, combination at most 4 psi.
    expect(rows).toEqual(
      expect.arrayContaining([
        { item: 'air.static_leak', limitText: '3 psi/min' },
        { item: 'air.applied_leak', limitText: '4 psi/min' },
      ]),
    );
  });

  it('every defect sits on a unit that has that component', async () => {
    const rows = await f.db
      .selectFrom('defect as df')
      .innerJoin('unit as u', 'u.id', 'df.unitId')
      .innerJoin('inspectionStep as s', 's.id', 'df.stepId')
      .select(['df.component', 'df.zone', 's.item', 'u.kind', 'u.unitNumber'])
      .where('df.fleetId', '=', f.fleet.id)
      .execute();
    expect(rows.length).toBeGreaterThan(10);
    // Parts only a trailer has, parts only a tractor has.
    const trailerOnly = /^(rear impact guard|trailer tire|landing gear|door latch|kingpin)/;
    const tractorOnly =
      /^(steer tire|drive tire|windshield|wiper blade|fire extinguisher|steering|governor|low-air|fifth wheel)/;
    const misplaced = rows.filter(
      (r) =>
        ((trailerOnly.test(r.component) || r.zone.includes('trailer') || r.item === 'rear.ground_clearance') &&
          r.kind !== 'trailer') ||
        (tractorOnly.test(r.component) && r.kind !== 'tractor'),
    );
    expect(misplaced.map((r) => `${r.component} (${r.item ?? r.zone}) on ${r.kind} ${r.unitNumber}`)).toEqual([]);
    expect(rows.some((r) => r.item === 'rear.ground_clearance' || /impact guard/.test(r.component))).toBe(true);
  });
});
