// Turns a reading taken at a checklist item into the input of a lib/rules check, with the unit's
// own data (cold-inflation targets, brake chamber types), and judges it. Pure: the walk screen
// uses it for the instant verdict and the server for the verdict of record.
import { evaluateMeasurement, type EvaluationResult } from '@/lib/rules';
import type { MeasureKind } from '@/lib/schemas/grammar';
import type { Axle } from '@/lib/schemas/units';
import type { ReadingInput } from './step';

export type CheckContext = {
  tractorAxles: readonly Axle[];
  trailerAxles: readonly Axle[];
  hasTrailer: boolean;
  trailerYear: number | null;
  /** The fleet's default cold targets, psi, where a unit has no axle data. */
  fleetTargets: { steer: number; drive: number; trailer: number };
  /** psi below the cold target still taken as on target (the fleet's gauge tolerance). */
  tirePressureTolerancePsi?: number;
};

/**
 * Default tire-pressure tolerance: 2 psi, about what a truck-tire dial or stick gauge can be
 * trusted to (common practice, no published source). A fleet sets its own in its settings.
 */
export const DEFAULT_TIRE_PRESSURE_TOLERANCE_PSI = 2;

type Item = { id: string; component: string; measure?: MeasureKind | undefined };

const tirePositionOf = (component: string): 'steer' | 'drive' | 'trailer' =>
  component.startsWith('steer') ? 'steer' : component.startsWith('trailer') ? 'trailer' : 'drive';

const onTrailer = (itemId: string) => /^(dsl|psl|rear)\./.test(itemId);

/** Steering wheels of heavy trucks are commonly 18–20 in with power steering (common practice, no published source). */
export const DEFAULT_STEERING_WHEEL_IN = 20;

/** The rules-check input for this reading, or null when no published check judges it. */
export function buildCheckInput(item: Item, reading: ReadingInput, ctx: CheckContext): Record<string, unknown> | null {
  const value = reading.value;
  switch (item.measure) {
    case 'tread_depth':
      return { check: 'tread_depth', position: tirePositionOf(item.component), value };
    case 'tire_pressure': {
      const position = tirePositionOf(item.component);
      const axles = position === 'trailer' ? ctx.trailerAxles : ctx.tractorAxles;
      const target = axles.find((a) => a.position === position)?.coldPsi ?? ctx.fleetTargets[position];
      return { check: 'tire_pressure', position, target, value };
    }
    case 'pushrod_stroke': {
      const axles = onTrailer(item.id) ? ctx.trailerAxles : ctx.tractorAxles;
      const chamber = reading.chamber ?? axles.find((a) => a.position !== 'steer')?.chamber ?? '30';
      return { check: 'pushrod_stroke', chamber, value };
    }
    case 'steering_lash':
      return {
        check: 'steering_lash',
        wheel_diameter: reading.wheelDiameter ?? DEFAULT_STEERING_WHEEL_IN,
        power: reading.power ?? true,
        value,
      };
    case 'air_buildup':
      return { check: 'air_buildup', from: 85, to: 100, seconds: value };
    case 'governor_cutout':
      return { check: 'governor_cutout', value };
    case 'governor_cutin':
      return { check: 'governor_cutin', value };
    case 'air_leak':
      return {
        check: 'air_leak',
        mode: item.id.includes('applied') ? 'applied' : 'released',
        combination: ctx.hasTrailer,
        value,
      };
    case 'low_air_warning':
      return { check: 'low_air_warning', value };
    case 'ground_clearance':
      return ctx.trailerYear
        ? { check: 'rear_impact_guard', ground_clearance: value, trailer_built_year: ctx.trailerYear }
        : null;
    default:
      return null;
  }
}

/** The unit a reading or a finding belongs to: the trailer for trailer-side items when there is one. */
export function isTrailerItem(itemId: string | null, zone: string, componentId: string | null): boolean {
  if (itemId && onTrailer(itemId)) return true;
  if (/trailer/.test(zone) || zone === 'rear') return true;
  return (
    !!componentId &&
    /^(trailer_|landing_gear|kingpin|upper_coupler|crank_handle|sand_shoe|tandem_pins|slider_pins|rear_impact_guard|conspicuity_tape)/.test(
      componentId,
    )
  );
}

export const measureUnit: Record<MeasureKind, string> = {
  tread_depth: '32nds',
  tire_pressure: 'psi',
  pushrod_stroke: 'in',
  low_air_warning: 'psi',
  air_buildup: 's',
  governor_cutout: 'psi',
  governor_cutin: 'psi',
  air_leak: 'psi',
  steering_lash: 'in',
  fifth_wheel_movement: 'in',
  ground_clearance: 'in',
};

export type ReadingVerdict =
  { judged: true; result: EvaluationResult; withinTolerance: boolean } | { judged: false; error: string | null };

/**
 * The verdict of record on one reading: the rules check, with the fleet's tire-pressure tolerance
 * applied (a reading that far under the cold target passes, and says so). `judged: false` with no
 * error means no published check judges this reading; it is recorded as measured.
 */
export function judgeReading(item: Item, reading: ReadingInput, ctx: CheckContext, profile: string): ReadingVerdict {
  const input = buildCheckInput(item, reading, ctx);
  if (!input) return { judged: false, error: null };
  const outcome = evaluateMeasurement(input, { profile });
  if ('error' in outcome) return { judged: false, error: outcome.error };
  const tolerance = ctx.tirePressureTolerancePsi ?? DEFAULT_TIRE_PRESSURE_TOLERANCE_PSI;
  if (
    outcome.check === 'tire_pressure' &&
    outcome.verdict === 'fail' &&
    outcome.severity === 'minor' &&
    outcome.limit !== null &&
    reading.value >= outcome.limit - tolerance
  ) {
    return {
      judged: true,
      withinTolerance: true,
      result: {
        ...outcome,
        verdict: 'pass',
        severity: null,
        level: 'pass',
        message: `Tire pressure ${reading.value} psi is within the fleet's ${tolerance} psi gauge tolerance of the ${outcome.limit} psi cold target.`,
      },
    };
  }
  return { judged: true, withinTolerance: false, result: outcome };
}
