// Sixty days of an invented fleet's inspections: pre-trips and post-trips with findings,
// measurements judged by lib/rules, defects, mechanics' repairs, next drivers'
// acknowledgements, supervisor reviews and a few utterances that matched nothing. Deterministic
// (seeded random numbers, ids derived from names), and skipped when the fleet has history.
import { createHash } from 'node:crypto';
import type { Insertable } from 'kysely';
import type { DB } from '../connect';
import type { Acknowledgement, Defect, FieldUtterance, Inspection, InspectionStep } from '../schema';
import zonesGrammar from '../../grammars/zones.json' with { type: 'json' };
import vocabulary from '../../grammars/vocabulary.json' with { type: 'json' };
import { evaluateMeasurement, type EvaluationResult } from '../../lib/rules';
import {
  certificationStatement,
  hashReport,
  isTrailerItem,
  listWalkZones,
  nameFinding,
  nameReading,
  REPORT_FORMAT,
} from '../../lib/walk';
import type { Zones } from '../../lib/schemas/grammar';

export { certificationStatement };
const ackStatement = 'I reviewed the last inspection report of this unit and the repair certification of its defects.';
const repairStatement =
  'I certify that the defect listed was repaired, or that its repair is unnecessary for safe operation.';

/** A small seeded generator (mulberry32), so that every seed run tells the same story. */
function rng(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    chance: (p: number) => next() < p,
    int: (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1)),
    pick: <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)]!,
  };
}

/** A stable UUID from a name. */
export function uuidFrom(name: string): string {
  const h = createHash('sha256').update(name).digest('hex');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-a${h.slice(17, 20)}-${h.slice(20, 32)}`;
}

type Scenario = {
  heard: string;
  component: string;
  condition: string;
  position: string | null;
  zone: string;
  score: number;
  unit: 'tractor' | 'trailer';
};

// Findings drivers said in this invented history (words as a recogniser might return them).
const scenarios: Scenario[] = [
  {
    heard: 'bulge on the left steer tire',
    component: 'steer_tire',
    condition: 'bulge',
    position: 'left',
    zone: 'front',
    score: 0.93,
    unit: 'tractor',
  },
  {
    heard: 'clearance light out top right',
    component: 'clearance_light',
    condition: 'inoperative',
    position: 'right',
    zone: 'rear',
    score: 0.88,
    unit: 'trailer',
  },
  {
    heard: 'air leak at the glad hands',
    component: 'glad_hand',
    condition: 'audible_air_leak',
    position: null,
    zone: 'coupling',
    score: 0.81,
    unit: 'tractor',
  },
  {
    heard: 'windshield chip passenger side',
    component: 'windshield',
    condition: 'chipped',
    position: 'right',
    zone: 'front',
    score: 0.9,
    unit: 'tractor',
  },
  {
    heard: 'mud flap torn driver side',
    component: 'mud_flap',
    condition: 'broken',
    position: 'left',
    zone: 'driver_side_trailer',
    score: 0.74,
    unit: 'trailer',
  },
  {
    heard: 'marker lamp cracked left side',
    component: 'marker_light',
    condition: 'cracked',
    position: 'left',
    zone: 'driver_side_trailer',
    score: 0.86,
    unit: 'trailer',
  },
  {
    heard: 'wiper blade torn',
    component: 'wiper_blade',
    condition: 'worn',
    position: null,
    zone: 'front',
    score: 0.84,
    unit: 'tractor',
  },
  {
    heard: 'brake chamber leaking axle two right',
    component: 'brake_chamber',
    condition: 'audible_air_leak',
    position: 'axle 2',
    zone: 'passenger_side_trailer',
    score: 0.79,
    unit: 'trailer',
  },
  {
    heard: 'landing gear crank bent',
    component: 'landing_gear',
    condition: 'bent',
    position: null,
    zone: 'coupling',
    score: 0.71,
    unit: 'trailer',
  },
  {
    heard: 'fire extinguisher missing',
    component: 'fire_extinguisher',
    condition: 'missing',
    position: null,
    zone: 'in_cab',
    score: 0.92,
    unit: 'tractor',
  },
  {
    heard: 'lug nut loose right rear drive',
    component: 'lug_nut',
    condition: 'loose',
    position: 'right',
    zone: 'passenger_side_tractor',
    score: 0.83,
    unit: 'tractor',
  },
  {
    heard: 'rear door latch wont lock',
    component: 'door_latch',
    condition: 'not_locked',
    position: 'rear',
    zone: 'rear',
    score: 0.66,
    unit: 'trailer',
  },
];

const unmatchedSaid = [
  'the reefer is making that noise again',
  'check the thingy by the tank',
  'dispatch says door twelve',
  'mirror bracket wobbles kinda',
  'is that a crack or dirt',
];

type VocabComponent = {
  id: string;
  name: string;
  defects: { condition: string; severity: { us?: 'minor' | 'major'; ca?: 'minor' | 'major' } }[];
};
type VocabCondition = { id: string; name: string };
const vocab = vocabulary as unknown as { version: number; components: VocabComponent[]; conditions: VocabCondition[] };

function vocabTerm(componentId: string, conditionId: string) {
  const comp = vocab.components.find((c) => c.id === componentId);
  const cond = vocab.conditions.find((c) => c.id === conditionId);
  const pair = comp?.defects.find((d) => d.condition === conditionId);
  return {
    component: comp?.name ?? componentId.replace(/_/g, ' '),
    condition: cond?.name ?? conditionId.replace(/_/g, ' '),
    severity: pair?.severity.us ?? ('major' as const), // unclassified: safe side
  };
}

function tirePosition(zoneId: string): 'steer' | 'drive' | 'trailer' {
  if (zoneId === 'front') return 'steer';
  return zoneId.includes('trailer') ? 'trailer' : 'drive';
}

/** A reading for one measured item: usually healthy, now and then over a limit. */
function reading(
  r: ReturnType<typeof rng>,
  measure: string,
  zoneId: string,
  trailerYear: number | null,
): Record<string, unknown> | null {
  const bad = r.chance(0.012);
  switch (measure) {
    case 'tread_depth': {
      const position = tirePosition(zoneId);
      const value = bad ? (position === 'steer' ? 3 : 1) : position === 'steer' ? r.int(6, 14) : r.int(4, 16);
      return { check: 'tread_depth', position, value };
    }
    case 'tire_pressure': {
      const target = zoneId === 'front' ? 110 : 100;
      return {
        check: 'tire_pressure',
        target,
        max_cold: 120,
        value: bad ? target - r.int(12, 25) : target + r.int(0, 4),
      };
    }
    case 'pushrod_stroke':
      return {
        check: 'pushrod_stroke',
        chamber: zoneId.includes('trailer') ? '30L' : '30',
        value: bad ? 2.125 : r.pick([1.25, 1.375, 1.5, 1.625]),
      };
    case 'steering_lash':
      return { check: 'steering_lash', wheel_diameter: 20, power: true, value: bad ? 6 : r.pick([1, 1.5, 2, 2.5]) };
    case 'air_buildup':
      return { check: 'air_buildup', from: 85, to: 100, seconds: bad ? r.int(50, 70) : r.int(22, 40) };
    case 'governor_cutout':
      return { check: 'governor_cutout', value: r.int(122, 130) };
    case 'governor_cutin':
      return { check: 'governor_cutin', value: bad ? 92 : r.int(100, 108) };
    case 'air_leak':
      return null; // handled with its mode below
    case 'low_air_warning':
      return { check: 'low_air_warning', value: bad ? 52 : r.int(60, 68) };
    case 'ground_clearance':
      return trailerYear
        ? { check: 'rear_impact_guard', ground_clearance: bad ? 23 : r.int(18, 21), trailer_built_year: trailerYear }
        : null;
    default:
      return null;
  }
}

const spokenUnit: Record<string, string> = {
  tread_depth: '32nds',
  tire_pressure: 'psi',
  pushrod_stroke: 'in',
  steering_lash: 'in',
  air_buildup: 's',
  governor_cutout: 'psi',
  governor_cutin: 'psi',
  air_leak: 'psi',
  low_air_warning: 'psi',
  rear_impact_guard: 'in',
};

/** A unit as a recogniser writes it out ("7 thirty seconds", "110 psi"). */
const saidUnit: Record<string, string> = { '32nds': 'thirty seconds', psi: 'psi', in: 'inches', s: 'seconds' };

export async function seedHistory(db: DB, opts: { fleetSlug: string; days?: number; now?: Date }) {
  const days = opts.days ?? 60;
  const now = opts.now ?? new Date();
  const fleet = await db
    .selectFrom('fleet')
    .select(['id'])
    .where('slug', '=', opts.fleetSlug)
    .executeTakeFirstOrThrow();
  const existing = await db
    .selectFrom('inspection')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('fleetId', '=', fleet.id)
    .executeTakeFirstOrThrow();
  if (Number(existing.n) > 0) return { skipped: true as const, inspections: Number(existing.n) };

  const users = await db
    .selectFrom('appUser')
    .select(['id', 'name', 'roles'])
    .where('fleetId', '=', fleet.id)
    .orderBy('email')
    .execute();
  const drivers = users.filter((u) => u.roles.includes('driver'));
  const mechanic = users.find((u) => u.roles.includes('mechanic'));
  const supervisor = users.find((u) => u.roles.includes('supervisor'));
  if (!drivers.length || !mechanic || !supervisor)
    throw new Error('the demo fleet needs drivers, a mechanic and a supervisor before its history');
  const units = await db
    .selectFrom('unit')
    .select(['id', 'kind', 'unitNumber', 'year'])
    .where('fleetId', '=', fleet.id)
    .orderBy('unitNumber')
    .execute();
  const tractors = units.filter((u) => u.kind === 'tractor');
  const trailers = units.filter((u) => u.kind === 'trailer');

  const versionId = uuidFrom(`${opts.fleetSlug}:vocabulary:default`);
  await db
    .insertInto('vocabularyVersion')
    .values({
      id: versionId,
      fleetId: fleet.id,
      label: `default v${vocab.version}`,
      status: 'published',
      grammar: JSON.stringify(vocabulary),
      publishedAt: new Date(now.getTime() - (days + 1) * 86_400_000),
    })
    .onConflict((oc) => oc.column('id').doNothing())
    .execute();

  const r = rng(20261201);
  const inspections: Insertable<Inspection>[] = [];
  const steps: Insertable<InspectionStep>[] = [];
  const defects: Insertable<Defect>[] = [];
  const acks: Insertable<Acknowledgement>[] = [];
  const utterances: Insertable<FieldUtterance>[] = [];
  // Per unit: the last submitted report and its defects, for the next driver's review.
  const lastReport = new Map<string, { inspectionId: string; defectIds: string[]; certifiedBy: Date | null }>();
  const dayMs = 86_400_000;
  const startOfToday = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());

  for (let d = days; d >= 0; d--) {
    const dayStart = startOfToday - d * dayMs;
    for (const [di, driver] of drivers.entries()) {
      if (!r.chance(d === 0 ? 0.5 : 0.82)) continue;
      const tractor = tractors[di % tractors.length]!;
      const trailer = r.chance(0.9) ? r.pick(trailers) : null;
      for (const kind of ['pre_trip', 'post_trip'] as const) {
        if (kind === 'post_trip' && (d === 0 || !r.chance(0.65))) continue;
        const inspectionId = uuidFrom(`${opts.fleetSlug}:${d}:${driver.id}:${kind}`);
        const startedAt = new Date(
          dayStart +
            (kind === 'pre_trip' ? 11 * 3600_000 + r.int(0, 90) * 60_000 : 22 * 3600_000 + r.int(0, 60) * 60_000),
        );
        const short = r.chance(0.08);
        const minutes = kind === 'pre_trip' ? (short ? r.int(6, 12) : r.int(16, 31)) : r.int(5, 12);
        const finishedAt = new Date(startedAt.getTime() + minutes * 60_000);
        const config = trailer ? 'tractor_trailer' : 'bobtail';
        // The walk's zones and items from the one function the app uses (no air-brake tests after a trip).
        const walk = listWalkZones(zonesGrammar as unknown as Zones, { kind, configuration: config });
        const stepMs = (minutes * 60_000) / (walk.length * 4 + 4);
        let seq = 0;
        let t = startedAt.getTime();
        const mine: Insertable<InspectionStep>[] = [];
        const myDefects: Insertable<Defect>[] = [];
        const push = (
          s: Omit<Insertable<InspectionStep>, 'id' | 'fleetId' | 'inspectionId' | 'seq' | 'deviceAt' | 'serverAt'>,
        ) => {
          t += stepMs * (0.5 + r.next());
          const id = uuidFrom(`${inspectionId}:step:${seq}`);
          const row: Insertable<InspectionStep> = {
            id,
            fleetId: fleet.id,
            inspectionId,
            seq: seq++,
            deviceAt: new Date(t),
            serverAt: new Date(t + r.int(80, 900)),
            alternatives: '[]',
            ...s,
          };
          mine.push(row);
          return row;
        };
        const addDefect = (
          step: Insertable<InspectionStep>,
          unitId: string,
          severity: 'minor' | 'major',
          description: string,
        ) => {
          myDefects.push({
            id: uuidFrom(`${step.id}:defect`),
            fleetId: fleet.id,
            inspectionId,
            stepId: step.id,
            unitId,
            zone: step.zone,
            component: step.component ?? 'unknown',
            condition:
              step.condition ?? `${String(step.measurementKind ?? 'reading').replace(/_/g, ' ')} fails the limit`,
            position: step.position ?? null,
            severity,
            description,
            createdAt: step.deviceAt,
          });
        };
        const finding =
          kind === 'pre_trip' && r.chance(0.2)
            ? r.pick(scenarios.filter((s) => s.unit === 'tractor' || trailer))
            : null;
        // A signed report answers every item: a short walk is short on time, never missing a zone.
        for (const zone of walk) {
          push({ zone: zone.id, kind: 'visit', inputMode: 'tap' });
          for (const item of zone.items.filter(
            (i) => i.configurations.includes(config) && i.measure && kind === 'pre_trip',
          )) {
            // Each leakage item names its own brake state: "leakage, brakes applied" or "…, brakes released".
            const modes = item.measure === 'air_leak' ? [/applied/.test(item.id) ? 'applied' : 'released'] : [null];
            for (const mode of modes) {
              const input = mode
                ? {
                    check: 'air_leak',
                    mode,
                    combination: !!trailer,
                    value: r.chance(0.02) ? 6 : mode === 'applied' ? r.pick([0, 1, 2, 3]) : r.pick([0, 1, 1, 2]),
                  }
                : reading(r, item.measure!, zone.id, trailer?.year ?? null);
              if (!input) continue;
              const verdict = evaluateMeasurement(input) as EvaluationResult;
              const value = Number(input.value ?? input.seconds ?? input.ground_clearance);
              const voice = r.chance(0.7);
              const step = push({
                zone: zone.id,
                item: item.id,
                kind: 'measurement',
                inputMode: voice ? 'voice' : 'typed',
                heard: voice
                  ? `${item.label} ${value} ${saidUnit[spokenUnit[String(input.check)] ?? ''] ?? ''}`.trim()
                  : null,
                component: vocabTerm(item.component, 'worn').component,
                measurementKind: String(input.check),
                value,
                unit: spokenUnit[String(input.check)] ?? null,
                verdict: verdict.verdict,
                severity: verdict.severity,
                limitText: verdict.limit === null ? null : `${verdict.limit} ${verdict.unit}`,
                source: verdict.source,
                score: voice ? 0.95 : null,
                resolution: voice ? 'auto' : null,
              });
              if (verdict.verdict === 'fail' && verdict.severity) {
                addDefect(
                  step,
                  trailer && isTrailerItem(item.id, zone.id, item.component) ? trailer.id : tractor.id,
                  verdict.severity,
                  nameReading({
                    component: item.label,
                    check: String(input.check),
                    value,
                    unit: spokenUnit[String(input.check)] ?? null,
                    limitText: verdict.limit === null ? null : `${verdict.limit} ${verdict.unit}`,
                  }),
                );
              }
            }
          }
          if (finding && finding.zone === zone.id) {
            const term = vocabTerm(finding.component, finding.condition);
            const unsure = finding.score < 0.8;
            const step = push({
              zone: zone.id,
              kind: 'defect',
              inputMode: 'voice',
              heard: finding.heard,
              alternatives: JSON.stringify(
                unsure ? [`${finding.heard}s`, finding.heard.replace(/ on the| at the/, '')] : [],
              ),
              termKey: `${finding.component}:${finding.condition}`,
              component: term.component,
              condition: term.condition,
              position: finding.position,
              score: finding.score,
              resolution: unsure ? 'confirmed' : 'auto',
              severity: term.severity,
            });
            addDefect(
              step,
              finding.unit === 'trailer' && trailer ? trailer.id : tractor.id,
              term.severity,
              nameFinding({ component: term.component, condition: term.condition, position: finding.position }),
            );
          }
          if (r.chance(0.015)) {
            const said = r.pick(unmatchedSaid);
            utterances.push({
              fleetId: fleet.id,
              zone: zone.id,
              text: said,
              normalized: said.toLowerCase(),
              outcome: 'unmatched',
              createdAt: new Date(t),
            });
          }
          push({
            zone: zone.id,
            kind: 'zone_ok',
            inputMode: r.chance(0.75) ? 'voice' : 'tap',
            heard: r.pick(['all good', 'looks good', 'good here', 'all good next']),
            score: 1,
            resolution: 'auto',
          });
        }

        // The driver of this unit first acknowledged the last report that had defects.
        for (const unitId of [tractor.id, trailer?.id].filter((x): x is string => !!x)) {
          const prev = lastReport.get(unitId);
          if (prev && prev.defectIds.length) {
            acks.push({
              fleetId: fleet.id,
              unitId,
              reviewedInspectionId: prev.inspectionId,
              inspectionId,
              driverId: driver.id,
              signatureName: driver.name,
              statement: ackStatement,
              acknowledgedAt: new Date(startedAt.getTime() - 60_000),
            });
            lastReport.delete(unitId);
          }
        }

        const signedAt = new Date(finishedAt.getTime() + 20_000);
        const header = {
          id: inspectionId,
          fleetId: fleet.id,
          kind,
          driverId: driver.id,
          tractorId: tractor.id,
          trailerId: trailer?.id ?? null,
          odometer: 412_000 + di * 37_000 + (days - d) * 480 + (kind === 'post_trip' ? 430 : 0),
          location: r.pick([
            'Millbrook Terminal, yard B',
            'Millbrook Terminal, fuel island',
            'Cedar Flats drop yard',
            'Hollis Junction customer lot',
          ]),
          billOfLading: trailer && r.chance(0.7) ? `NB-${r.int(100000, 999999)}` : null,
          sealNumber: trailer && r.chance(0.6) ? String(r.int(1000000, 9999999)) : null,
          ruleProfile: 'us-federal',
          vocabularyVersionId: versionId,
          startedAt,
          finishedAt,
          certificationText: certificationStatement,
          signatureName: driver.name,
          signedAt,
        };
        const contentHash = hashReport(
          header,
          mine.map((s) => ({
            id: s.id,
            seq: s.seq,
            zone: s.zone,
            item: s.item ?? null,
            kind: s.kind,
            heard: s.heard ?? null,
            termKey: s.termKey ?? null,
            component: s.component ?? null,
            condition: s.condition ?? null,
            position: s.position ?? null,
            score: s.score ?? null,
            resolution: s.resolution ?? null,
            undoesStepId: s.undoesStepId ?? null,
            measurementKind: s.measurementKind ?? null,
            value: (s.value as number | null | undefined) ?? null,
            unit: s.unit ?? null,
            verdict: s.verdict ?? null,
            severity: s.severity ?? null,
            deviceAt: s.deviceAt as Date,
            serverAt: s.serverAt as Date,
            notCheckedReason: s.notCheckedReason ?? null,
            note: s.note ?? null,
          })),
          { photos: [], signatureSha256: null },
        );
        const reviewed = myDefects.length > 0 && d > 2;
        inspections.push({
          ...header,
          status: 'submitted',
          durationS: minutes * 60,
          contentHash,
          reportFormat: REPORT_FORMAT,
          durationSource: 'server',
          reviewedAt: reviewed ? new Date(finishedAt.getTime() + 5 * 3600_000) : null,
          reviewedBy: reviewed ? supervisor.id : null,
          reviewNote: reviewed ? 'Defect reported; repair and next driver acknowledgement followed.' : null,
          createdAt: startedAt,
        });
        steps.push(...mine);

        // Repairs: certified within a day or two, except the newest, which stay open.
        for (const defect of myDefects) {
          const certified = d >= 2 || (d === 1 && r.chance(0.5));
          if (certified) {
            const at = new Date(finishedAt.getTime() + r.int(2, 30) * 3600_000);
            const unnecessary = defect.severity === 'minor' && r.chance(0.15);
            Object.assign(defect, {
              status: unnecessary ? 'no_repair_needed' : 'repaired',
              repairWork: unnecessary
                ? 'Inspected; within limits, no repair needed.'
                : `Replaced or adjusted: ${defect.component}.`,
              repairParts: unnecessary
                ? null
                : r.pick(['stock part from shop shelf', 'OEM replacement', 'none (adjustment only)']),
              certifiedBy: mechanic.id,
              certifiedName: mechanic.name,
              certificationText: repairStatement,
              certifiedAt: at,
            });
          }
        }
        defects.push(...myDefects);
        for (const unitId of [tractor.id, trailer?.id].filter((x): x is string => !!x)) {
          const own = myDefects.filter((x) => x.unitId === unitId);
          if (own.length) lastReport.set(unitId, { inspectionId, defectIds: own.map((x) => x.id!), certifiedBy: null });
        }
      }
    }
  }

  await db.transaction().execute(async (trx) => {
    const chunk = async <T>(rows: T[], size: number, insert: (part: T[]) => Promise<unknown>) => {
      for (let i = 0; i < rows.length; i += size) await insert(rows.slice(i, i + size));
    };
    await chunk(inspections, 200, (part) =>
      trx
        .insertInto('inspection')
        .values(part)
        .onConflict((oc) => oc.column('id').doNothing())
        .execute(),
    );
    await chunk(steps, 1000, (part) =>
      trx
        .insertInto('inspectionStep')
        .values(part)
        .onConflict((oc) => oc.column('id').doNothing())
        .execute(),
    );
    await chunk(defects, 500, (part) =>
      trx
        .insertInto('defect')
        .values(part)
        .onConflict((oc) => oc.column('id').doNothing())
        .execute(),
    );
    await chunk(acks, 500, (part) => trx.insertInto('acknowledgement').values(part).execute());
    if (utterances.length) await trx.insertInto('fieldUtterance').values(utterances).execute();
    // A unit is out of service while any major defect on it is open.
    const openMajor = new Set(
      defects.filter((x) => x.severity === 'major' && (x.status ?? 'open') === 'open').map((x) => x.unitId),
    );
    for (const unit of units) {
      await trx
        .updateTable('unit')
        .set({ status: openMajor.has(unit.id) ? 'out_of_service' : 'in_service' })
        .where('id', '=', unit.id)
        .execute();
    }
  });
  return {
    skipped: false as const,
    inspections: inspections.length,
    steps: steps.length,
    defects: defects.length,
    acknowledgements: acks.length,
  };
}
