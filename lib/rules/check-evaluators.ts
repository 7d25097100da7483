import {
  COMMON_PRACTICE,
  createNotApplicableResult,
  findEffectiveLimit,
  formatInches,
  judgeLimit,
  meetsLimit,
  roundTo,
  scaleEffectiveLimit,
  scaleRule,
  tightenLimit,
} from './judge-limit';
import type { JudgeContext } from './judge-limit';
import { normalizeChamberKey, pushrodStrokeTable } from './pushrod-stroke-table';
import { isFieldError, readBoolean, readChoice, readNumber, readOptionalNumber } from './read-fields';
import type { FieldError, Fields } from './read-fields';
import { findSteeringLashRow } from './steering-lash-table';
import type {
  CheckName,
  EvaluationOutcome,
  EvaluationResult,
  FleetSettings,
  Rule,
  RuleProfile,
  TirePosition,
} from './types';

export type CheckContext = { profile: RuleProfile; fleet: FleetSettings | undefined };
export type CheckEvaluator = (fields: Fields, context: CheckContext) => EvaluationOutcome;

const TIRE_POSITIONS: readonly TirePosition[] = ['steer', 'drive', 'trailer'];

function findRule(profile: RuleProfile, id: string): Rule | FieldError {
  return profile.rules[id] ?? { error: `profile ${profile.id} has no rule ${id}` };
}

function createContext(
  context: CheckContext,
  check: CheckName,
  unit: string,
  subject: string,
  formatValue: (value: number) => string,
): JudgeContext {
  return { profile: context.profile.id, check, unit, subject, formatValue };
}

const formatPsi = (value: number) => `${roundTo(value, 1)} psi`;
const formatSeconds = (value: number) => `${roundTo(value, 1)} s`;
const formatLoss = (value: number) => `${roundTo(value, 2)} psi in one minute`;
const format32nds = (value: number) => `${roundTo(value, 2)}/32 in`;

const evaluateTreadDepth: CheckEvaluator = (fields, context) => {
  const position = readChoice(fields, 'position', TIRE_POSITIONS);
  if (isFieldError(position)) return position;
  const value = readNumber(fields, 'value', { unit: '32nds of an inch' });
  if (isFieldError(value)) return value;
  const rule = findRule(context.profile, `tread_depth.${position}`);
  if (isFieldError(rule)) return rule;
  const subject = `${position[0]?.toUpperCase()}${position.slice(1)} tire tread`;
  return judgeLimit(rule, value, context.fleet, createContext(context, 'tread_depth', '32nds', subject, format32nds));
};

/**
 * Cold-pressure estimate of a hot reading, 49 CFR 393.75(h)(2) Table 1. Only the 41–55 mph row is
 * known (5 psi for tires rated up to 4,000 lb, 15 psi above); other speeds return null.
 */
export function estimateColdPressure(hotPsi: number, ratedLoadLb: number, averageSpeedMph: number): number | null {
  if (averageSpeedMph < 41 || averageSpeedMph > 55) return null;
  return hotPsi - (ratedLoadLb <= 4000 ? 5 : 15);
}

const evaluateTirePressure: CheckEvaluator = (fields, context) => {
  const target = readNumber(fields, 'target', { allowZero: false, unit: 'psi' });
  if (isFieldError(target)) return target;
  const measured = readNumber(fields, 'value', { unit: 'psi' });
  if (isFieldError(measured)) return measured;
  const maxCold = readOptionalNumber(fields, 'max_cold', { allowZero: false, unit: 'psi' });
  if (isFieldError(maxCold)) return maxCold;
  const position = fields.position === undefined ? undefined : readChoice(fields, 'position', TIRE_POSITIONS);
  if (isFieldError(position)) return position;
  const hot = readBoolean(fields, 'hot', false);
  if (isFieldError(hot)) return hot;

  let value = measured;
  let heatNote = '';
  if (hot) {
    const ratedLoad = readNumber(fields, 'rated_load_lb', { allowZero: false, unit: 'lb' });
    if (isFieldError(ratedLoad)) return ratedLoad;
    const speed = readNumber(fields, 'avg_speed_mph', { unit: 'mph' });
    if (isFieldError(speed)) return speed;
    const cold = estimateColdPressure(measured, ratedLoad, speed);
    if (cold === null) {
      return { error: `no heat correction is known for an average speed of ${speed} mph: check the pressure cold` };
    }
    value = Math.max(0, cold);
    heatNote = ` (estimated cold from ${formatPsi(measured)} hot, 49 CFR 393.75(h)(2) Table 1)`;
  }

  const flatRule = findRule(context.profile, 'tire_pressure.flat');
  if (isFieldError(flatRule)) return flatRule;
  const targetRule = findRule(context.profile, 'tire_pressure.target');
  if (isFieldError(targetRule)) return targetRule;

  // Flat is judged against the sidewall maximum. Without it, half the target is used: the target is
  // never above the maximum, so a tire at or below half its target is certainly flat.
  const flatBase = maxCold ?? target;
  const flatEffective = scaleEffectiveLimit(findEffectiveLimit(flatRule, context.fleet), flatBase);
  const flatContext = createContext(context, 'tire_pressure', 'psi', `Tire pressure${heatNote}`, formatPsi);
  const flat = judgeLimit(
    scaleRule(flatRule, flatBase, 'pressure_psi'),
    value,
    context.fleet,
    flatContext,
    flatEffective,
  );
  if (flat.verdict === 'fail') {
    flat.message +=
      maxCold === undefined
        ? ' The tire counts as flat (at or below half of its target; give max_cold for the sidewall rule).'
        : ' The tire counts as flat (at or below half of the maximum cold pressure on the sidewall).';
    return flat;
  }

  const fleetTarget = position === undefined ? undefined : context.fleet?.tirePressureTargets?.[position];
  const targetPsi = tightenLimit(target, 'min', true, fleetTarget);
  const fraction = findEffectiveLimit(targetRule, context.fleet);
  const targetEffective = {
    limit: fraction.limit * targetPsi.limit,
    inclusive: fraction.inclusive,
    tightened: fraction.tightened || targetPsi.tightened,
    ignored: fraction.ignored || targetPsi.ignored,
  };
  const result = judgeLimit(
    scaleRule(targetRule, targetPsi.limit, 'pressure_psi'),
    value,
    context.fleet,
    createContext(context, 'tire_pressure', 'psi', `Tire pressure${heatNote}`, formatPsi),
    targetEffective,
  );
  if (result.verdict === 'pass' && maxCold !== undefined && value > maxCold && !hot) {
    result.advisory = 'Above the maximum cold pressure on the sidewall: let it cool and check again';
    result.level = 'advisory';
    result.message += ` ${result.advisory} (${COMMON_PRACTICE}).`;
  }
  return result;
};

const evaluateLowAirWarning: CheckEvaluator = (fields, context) => {
  const value = readNumber(fields, 'value', { unit: 'psi' });
  if (isFieldError(value)) return value;
  const rule = findRule(context.profile, 'low_air_warning.min');
  if (isFieldError(rule)) return rule;
  return judgeLimit(
    rule,
    value,
    context.fleet,
    createContext(context, 'low_air_warning', 'psi', 'Low-air warning came on at', formatPsi),
  );
};

const evaluateAirBuildup: CheckEvaluator = (fields, context) => {
  const from = readNumber(fields, 'from', { unit: 'psi' });
  if (isFieldError(from)) return from;
  const to = readNumber(fields, 'to', { unit: 'psi' });
  if (isFieldError(to)) return to;
  const seconds = readNumber(fields, 'seconds', { unit: 's' });
  if (isFieldError(seconds)) return seconds;
  if (to <= from) return { error: `"to" (${to} psi) must be above "from" (${from} psi)` };
  const system = readChoice(fields, 'system', ['dual', 'single'] as const, 'dual');
  if (isFieldError(system)) return system;
  const rule = findRule(context.profile, `air_buildup.${system}`);
  if (isFieldError(rule)) return rule;
  const ruleFrom = rule.params?.from ?? from;
  const ruleTo = rule.params?.to ?? to;
  const prorated = from !== ruleFrom || to !== ruleTo;
  // A build-up timed over another span is judged against the limit scaled to that span.
  const factor = prorated ? (to - from) / (ruleTo - ruleFrom) : 1;
  const judge = createContext(
    context,
    'air_buildup',
    's',
    `Build-up ${roundTo(from, 1)} to ${roundTo(to, 1)} psi took`,
    formatSeconds,
  );
  const result = judgeLimit(
    scaleRule(rule, factor, 'duration_s'),
    seconds,
    context.fleet,
    judge,
    scaleEffectiveLimit(findEffectiveLimit(rule, context.fleet), factor),
  );
  if (prorated) {
    result.prorated = true;
    result.message += ` The test times ${ruleFrom} to ${ruleTo} psi; the limit was scaled to the span you timed.`;
  }
  if (result.verdict === 'fail' && context.profile.jurisdiction === 'us' && system === 'dual') {
    result.message += ' Larger than minimum tanks may take longer: check the maker\u2019s spec.';
  }
  return result;
};

const evaluateGovernorCutout: CheckEvaluator = (fields, context) => {
  const value = readNumber(fields, 'value', { unit: 'psi' });
  if (isFieldError(value)) return value;
  const maxRule = findRule(context.profile, 'governor_cutout.max');
  if (isFieldError(maxRule)) return maxRule;
  const minRule = profileRuleOrUndefined(context.profile, 'governor_cutout.min');
  const judge = createContext(context, 'governor_cutout', 'psi', 'Governor cut-out at', formatPsi);
  const upper = judgeLimit(maxRule, value, context.fleet, judge);
  const lower = minRule ? judgeLimit(minRule, value, context.fleet, judge) : undefined;
  const range = {
    min: lower?.limit ?? null,
    max: upper.limit,
  };
  let result = upper;
  if (upper.verdict === 'pass' && lower) {
    const nearerLower =
      lower.verdict === 'fail' ||
      (lower.limit !== null && upper.limit !== null && value - lower.limit < upper.limit - value);
    if (nearerLower) result = lower;
  }
  result.range = range;
  return result;
};

function profileRuleOrUndefined(profile: RuleProfile, id: string): Rule | undefined {
  return profile.rules[id];
}

const evaluateGovernorCutin: CheckEvaluator = (fields, context) => {
  const value = readNumber(fields, 'value', { unit: 'psi' });
  if (isFieldError(value)) return value;
  const rule = findRule(context.profile, 'governor_cutin.min');
  if (isFieldError(rule)) return rule;
  return judgeLimit(
    rule,
    value,
    context.fleet,
    createContext(context, 'governor_cutin', 'psi', 'Governor cut-in at', formatPsi),
  );
};

const evaluateAirLeak: CheckEvaluator = (fields, context) => {
  const mode = readChoice(fields, 'mode', ['applied', 'released'] as const);
  if (isFieldError(mode)) return mode;
  const combination = readBoolean(fields, 'combination');
  if (isFieldError(combination)) return combination;
  const value = readNumber(fields, 'value', { unit: 'psi lost in one minute' });
  if (isFieldError(value)) return value;
  const trailers = readOptionalNumber(fields, 'trailers', { integer: true });
  if (isFieldError(trailers)) return trailers;
  const vehicles =
    trailers !== undefined && trailers >= 2
      ? 'multiple'
      : combination || (trailers ?? 0) >= 1
        ? 'combination'
        : 'single';
  const rule = findRule(context.profile, `air_leak.${mode}.${vehicles}`);
  if (isFieldError(rule)) return rule;
  const who =
    vehicles === 'single' ? 'single vehicle' : vehicles === 'combination' ? 'combination' : 'three or more vehicles';
  return judgeLimit(
    rule,
    value,
    context.fleet,
    createContext(context, 'air_leak', 'psi/min', `Air loss (brakes ${mode}, ${who})`, formatLoss),
  );
};

const evaluatePushrodStroke: CheckEvaluator = (fields, context) => {
  const raw = fields.chamber;
  if (raw === undefined || raw === null) return { error: 'missing field "chamber" (e.g. "30", "30L", "24")' };
  if (typeof raw !== 'string' && typeof raw !== 'number') {
    return { error: '"chamber" must be a chamber type such as "30", "30L" or "24"' };
  }
  const key = normalizeChamberKey(String(raw));
  if (key === null) {
    const known = pushrodStrokeTable.map((row) => row.key).join(', ');
    return { error: `unknown chamber ${JSON.stringify(String(raw).slice(0, 40))}: known types are ${known}` };
  }
  const value = readNumber(fields, 'value', { unit: 'in' });
  if (isFieldError(value)) return value;
  const rule = findRule(context.profile, `pushrod_stroke.${key}`);
  if (isFieldError(rule)) return rule;
  const label = pushrodStrokeTable.find((row) => row.key === key)?.label ?? key;
  return judgeLimit(
    rule,
    value,
    context.fleet,
    createContext(context, 'pushrod_stroke', 'in', `Pushrod stroke (${label} chamber)`, formatInches),
  );
};

const evaluateSteeringLash: CheckEvaluator = (fields, context) => {
  const diameter = readNumber(fields, 'wheel_diameter', { allowZero: false, unit: 'in' });
  if (isFieldError(diameter)) return diameter;
  const power = readBoolean(fields, 'power');
  if (isFieldError(power)) return power;
  const value = readNumber(fields, 'value', { unit: 'in' });
  if (isFieldError(value)) return value;
  const steering = power ? 'power' : 'manual';
  const row = findSteeringLashRow(diameter);
  const subject = `Steering lash (${roundTo(diameter, 2)} in wheel, ${steering} steering)`;
  const judge = createContext(context, 'steering_lash', 'in', subject, formatInches);
  if (row) {
    const rule = findRule(context.profile, `steering_lash.${steering}.${row.wheelDiameterIn}`);
    if (isFieldError(rule)) return rule;
    return judgeLimit(rule, value, context.fleet, judge);
  }
  // Other diameters: the limit is an angle of wheel rotation; lash at the rim = π × D × angle / 360.
  const rule = findRule(context.profile, `steering_lash.${steering}.other`);
  if (isFieldError(rule)) return rule;
  const inchesPerDegree = (Math.PI * diameter) / 360;
  const result = judgeLimit(
    scaleRule(rule, inchesPerDegree, 'length_in'),
    value,
    context.fleet,
    judge,
    scaleEffectiveLimit(findEffectiveLimit(rule, context.fleet), inchesPerDegree),
  );
  const degrees = findEffectiveLimit(rule, context.fleet).limit;
  result.message += ` (${roundTo(degrees, 1)} degrees of wheel rotation on a wheel of this size.)`;
  return result;
};

const evaluateWindshieldDamage: CheckEvaluator = (fields, context) => {
  const diameter = readNumber(fields, 'diameter', { unit: 'in' });
  if (isFieldError(diameter)) return diameter;
  const inArea = readBoolean(fields, 'in_critical_area');
  if (isFieldError(inArea)) return inArea;
  const nearest = readOptionalNumber(fields, 'nearest_other', { unit: 'in' });
  if (isFieldError(nearest)) return nearest;
  const crackWidth = readOptionalNumber(fields, 'crack_width', { unit: 'in' });
  if (isFieldError(crackWidth)) return crackWidth;
  const intersections = readOptionalNumber(fields, 'crack_intersections', { integer: true });
  if (isFieldError(intersections)) return intersections;
  const judgeBase = { profile: context.profile.id, check: 'windshield_damage' as const, unit: 'in' };
  if (!inArea) {
    return createNotApplicableResult(
      judgeBase,
      '49 CFR 393.60(c) (protected area only)',
      'Damage outside the protected area (below the top of the steering wheel, or in the 2 in top or 1 in side border): no 393.60(c) limit applies. State law may still apply.',
    );
  }
  const judge = (subject: string, format: (value: number) => string) =>
    createContext(context, 'windshield_damage', 'in', subject, format);
  const checks: Array<[string, number | undefined, JudgeContext]> = [
    ['windshield_damage.spot_diameter', diameter, judge('Damaged spot in the protected area, across', formatInches)],
    ['windshield_damage.spot_separation', nearest, judge('Distance to the nearest other damaged spot', formatInches)],
    ['windshield_damage.crack_width', crackWidth, judge('Crack width in the protected area', formatInches)],
    [
      'windshield_damage.crack_intersections',
      intersections,
      judge('Cracks crossing this crack', (value) => `${value}`),
    ],
  ];
  let first: EvaluationResult | undefined;
  for (const [id, value, judgeContext] of checks) {
    if (value === undefined) continue;
    const rule = findRule(context.profile, id);
    if (isFieldError(rule)) return rule;
    const result = judgeLimit(rule, value, context.fleet, judgeContext);
    if (result.verdict === 'fail') return result;
    first ??= result;
  }
  return first ?? { error: 'nothing to judge' };
};

/** Trailers built on or after this date fall under 393.86(a). */
const REAR_GUARD_NEW_RULE_DATE = '1998-01-26';

const evaluateRearImpactGuard: CheckEvaluator = (fields, context) => {
  const clearance = readNumber(fields, 'ground_clearance', { unit: 'in' });
  if (isFieldError(clearance)) return clearance;
  const year = readNumber(fields, 'trailer_built_year', { integer: true });
  if (isFieldError(year)) return year;
  if (year < 1900 || year > 2200) return { error: `"trailer_built_year" ${year} is not a plausible year` };
  const builtDate = fields.trailer_built_date;
  if (builtDate !== undefined && (typeof builtDate !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(builtDate))) {
    return { error: '"trailer_built_date" must be a date written YYYY-MM-DD' };
  }
  const judgeBase = { profile: context.profile.id, check: 'rear_impact_guard' as const, unit: 'in' };
  if (year <= 1952) {
    return createNotApplicableResult(
      judgeBase,
      '49 CFR 393.86(b) (trailers built after 31 Dec 1952)',
      `Trailer built in ${year}: no rear impact guard rule applies.`,
    );
  }
  // Only the year known: a 1998 trailer is judged under the newer, stricter rule (safe side).
  const newRule = typeof builtDate === 'string' ? builtDate >= REAR_GUARD_NEW_RULE_DATE : year >= 1998;
  const rule = findRule(context.profile, newRule ? 'rear_impact_guard.since_1998' : 'rear_impact_guard.1953_to_1997');
  if (isFieldError(rule)) return rule;
  const result = judgeLimit(
    rule,
    clearance,
    context.fleet,
    createContext(
      context,
      'rear_impact_guard',
      'in',
      `Rear impact guard ground clearance (trailer built ${year})`,
      formatInches,
    ),
  );
  if (newRule && year === 1998 && typeof builtDate !== 'string') {
    result.message +=
      ' A trailer built before 26 Jan 1998 falls under the older 30 in rule: give trailer_built_date to tell.';
  }
  return result;
};

export const checkEvaluators: Readonly<Record<CheckName, CheckEvaluator>> = {
  tread_depth: evaluateTreadDepth,
  tire_pressure: evaluateTirePressure,
  low_air_warning: evaluateLowAirWarning,
  air_buildup: evaluateAirBuildup,
  governor_cutout: evaluateGovernorCutout,
  governor_cutin: evaluateGovernorCutin,
  air_leak: evaluateAirLeak,
  pushrod_stroke: evaluatePushrodStroke,
  steering_lash: evaluateSteeringLash,
  windshield_damage: evaluateWindshieldDamage,
  rear_impact_guard: evaluateRearImpactGuard,
};

/** Whether a measured value meets a rule as published (no fleet), for callers outside the checks. */
export function meetsRule(rule: Rule, value: number): boolean {
  return meetsLimit(value, rule.limit, rule.direction, rule.inclusive);
}
