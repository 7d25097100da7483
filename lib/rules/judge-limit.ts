import type { CheckName, EvaluationResult, FleetSettings, LimitDirection, ProfileId, Rule, Source } from './types';

/** Tolerance for floating-point noise in computed limits (e.g. the steering-lash angle formula). */
const EPSILON = 1e-9;

export const COMMON_PRACTICE = 'common practice, no published source';

/**
 * A rule's source as a reader sees it: the regulation or handbook it comes from, or "common
 * practice" for a rule of thumb. How sure the project is of a value (`source.status`) stays in the
 * rule tables and their tests; it is not printed on a report.
 */
export function formatSource(source: Source): string {
  return source.status === 'common-practice' && !/common practice/i.test(source.citation)
    ? `${source.citation} (common practice)`
    : source.citation;
}

/** Whether `value` meets a limit of the given direction. */
export function meetsLimit(value: number, limit: number, direction: LimitDirection, inclusive: boolean): boolean {
  if (direction === 'min') return inclusive ? value >= limit - EPSILON : value > limit + EPSILON;
  return inclusive ? value <= limit + EPSILON : value < limit - EPSILON;
}

export type EffectiveLimit = {
  limit: number;
  inclusive: boolean;
  /** A fleet limit made the rule stricter. */
  tightened: boolean;
  /** A fleet limit was given but was looser than the published one, so it was not applied. */
  ignored: boolean;
};

/**
 * The stricter of the published limit and a fleet limit. A fleet can tighten, never loosen.
 * A fleet value that is not a finite, non-negative number is ignored.
 */
export function tightenLimit(
  published: number,
  direction: LimitDirection,
  inclusive: boolean,
  fleetLimit: number | undefined,
): EffectiveLimit {
  if (fleetLimit === undefined || !Number.isFinite(fleetLimit) || fleetLimit < 0) {
    return { limit: published, inclusive, tightened: false, ignored: fleetLimit !== undefined };
  }
  const stricter = direction === 'min' ? fleetLimit > published : fleetLimit < published;
  if (stricter) return { limit: fleetLimit, inclusive: true, tightened: true, ignored: false };
  return { limit: published, inclusive, tightened: false, ignored: fleetLimit !== published };
}

/** The effective limit of a rule for a fleet. */
export function findEffectiveLimit(rule: Rule, fleet: FleetSettings | undefined): EffectiveLimit {
  return tightenLimit(rule.limit, rule.direction, rule.inclusive, fleet?.limits?.[rule.id]);
}

export type JudgeContext = {
  profile: ProfileId;
  check: CheckName;
  unit: string;
  /** Short plain words for what was measured, e.g. "Steer tire tread". */
  subject: string;
  formatValue: (value: number) => string;
};

/**
 * Judge one value against one rule: verdict, severity, advisory and out-of-service levels, and a
 * message in plain words.
 */
export function judgeLimit(
  rule: Rule,
  value: number,
  fleet: FleetSettings | undefined,
  context: JudgeContext,
  effective: EffectiveLimit = findEffectiveLimit(rule, fleet),
): EvaluationResult {
  const passes = meetsLimit(value, effective.limit, rule.direction, effective.inclusive);
  const shown = context.formatValue(value);
  const limitShown = context.formatValue(effective.limit);
  const word =
    rule.direction === 'min' ? (effective.inclusive ? 'at least' : 'above') : effective.inclusive ? 'at most' : 'below';
  const fleetWords = effective.tightened ? ' (fleet limit, stricter than the published one)' : '';

  let advisory: string | null = null;
  let oos: boolean | null = null;
  let level: EvaluationResult['level'] = 'pass';
  let message: string;

  if (passes) {
    if (rule.outOfService) oos = false;
    if (rule.advisory && !meetsLimit(value, rule.advisory.limit, rule.direction, rule.advisory.inclusive)) {
      advisory = rule.advisory.message;
      level = 'advisory';
    }
    message = `${context.subject} ${shown}: OK, the limit is ${word} ${limitShown}${fleetWords}.`;
    if (advisory) message += ` ${advisory}.`;
  } else {
    if (rule.outOfService) {
      oos = !meetsLimit(value, rule.outOfService.limit, rule.direction, rule.outOfService.inclusive);
    }
    level = oos === true ? 'out_of_service' : 'violation';
    const consequence =
      rule.severity === 'major'
        ? 'Major defect: do not drive until it is repaired.'
        : 'Minor defect: record it and have it repaired before the next inspection.';
    message = `${context.subject} ${shown}: fails, the limit is ${word} ${limitShown}${fleetWords}. ${consequence}`;
    if (oos === false && rule.outOfService) {
      message += ' It is a violation but does not reach the roadside out-of-service level.';
    } else if (oos === true && rule.outOfService) {
      message += ' It also reaches the roadside out-of-service level.';
    }
  }

  const result: EvaluationResult = {
    check: context.check,
    verdict: passes ? 'pass' : 'fail',
    severity: passes ? null : rule.severity,
    limit: roundLimit(effective.limit),
    source: effective.tightened ? `fleet setting; published: ${formatSource(rule.source)}` : formatSource(rule.source),
    source_status: rule.source.status,
    profile: context.profile,
    rule: `${context.profile}/${rule.id}`,
    unit: context.unit,
    level,
    oos,
    advisory,
    message,
  };
  if (effective.tightened) result.fleet_tightened = true;
  if (effective.ignored) result.fleet_ignored = true;
  return result;
}

export function roundLimit(value: number): number {
  return Math.round(value * 1000) / 1000;
}

/** Inches as a driver reads them off a rule: "2-1/8 in" when the value is a sixteenth, else decimals. */
export function formatInches(value: number): string {
  const sixteenths = Math.round(value * 16);
  if (Math.abs(sixteenths / 16 - value) > 1e-9 || value < 0) return `${roundTo(value, 2)} in`;
  const whole = Math.floor(sixteenths / 16);
  let numerator = sixteenths % 16;
  let denominator = 16;
  while (numerator !== 0 && numerator % 2 === 0) {
    numerator /= 2;
    denominator /= 2;
  }
  if (numerator === 0) return `${whole} in`;
  return whole === 0 ? `${numerator}/${denominator} in` : `${whole}-${numerator}/${denominator} in`;
}

export function roundTo(value: number, digits: number): number {
  const factor = 10 ** digits;
  return Math.round(value * factor) / factor;
}

/**
 * A rule expressed in another unit: limit, advisory and out-of-service levels multiplied by
 * `factor` (e.g. a fraction of the tire's maximum pressure into psi, degrees into inches at the rim).
 */
export function scaleRule(rule: Rule, factor: number, measurement: Rule['measurement']): Rule {
  const scaled: Rule = { ...rule, measurement, limit: rule.limit * factor };
  if (rule.advisory) scaled.advisory = { ...rule.advisory, limit: rule.advisory.limit * factor };
  if (rule.outOfService) scaled.outOfService = { ...rule.outOfService, limit: rule.outOfService.limit * factor };
  return scaled;
}

export function scaleEffectiveLimit(effective: EffectiveLimit, factor: number): EffectiveLimit {
  return { ...effective, limit: effective.limit * factor };
}

/** A pass that no limit applies to (e.g. damage outside the protected area). */
export function createNotApplicableResult(
  context: Pick<JudgeContext, 'profile' | 'check' | 'unit'>,
  source: string,
  message: string,
): EvaluationResult {
  return {
    check: context.check,
    verdict: 'pass',
    severity: null,
    limit: null,
    source,
    source_status: null,
    profile: context.profile,
    rule: null,
    unit: context.unit,
    level: 'pass',
    oos: null,
    advisory: null,
    message,
  };
}
