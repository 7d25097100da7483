/**
 * Shared types of the inspection rules. Pure data: no Node or browser APIs.
 */

export type Severity = 'minor' | 'major';
export type Verdict = 'pass' | 'fail';
export type ProfileId = 'us-federal' | 'ca-nsc13';
export type Jurisdiction = 'us' | 'ca';

/**
 * How sure we are of a value.
 * - `verified`: checked in a stored copy of the regulation or public handbook.
 * - `partly-verified`: some numbers checked, the rest from memory.
 * - `from-memory`: from memory, unverified. Such values are configurable through
 *   `customizeProfile` so that they can be corrected without a code change.
 * - `common-practice`: no published source; a trade habit or a carrier policy.
 */
export type SourceStatus = 'verified' | 'partly-verified' | 'from-memory' | 'common-practice';

export type Source = {
  /** Regulation section or public handbook, e.g. "49 CFR 393.75(b)". */
  citation: string;
  status: SourceStatus;
};

export type CheckName =
  | 'tread_depth'
  | 'tire_pressure'
  | 'low_air_warning'
  | 'air_buildup'
  | 'governor_cutout'
  | 'governor_cutin'
  | 'air_leak'
  | 'pushrod_stroke'
  | 'steering_lash'
  | 'windshield_damage'
  | 'rear_impact_guard';

/** What a rule measures, and in which unit. */
export type MeasurementKind =
  | 'tread_depth_32nds'
  | 'pressure_psi'
  | 'pressure_fraction'
  | 'duration_s'
  | 'pressure_loss_psi_per_min'
  | 'length_in'
  | 'angle_deg'
  | 'count';

/**
 * `min`: the value must be at least the limit (or above it when `inclusive` is false).
 * `max`: the value must be at most the limit (or below it when `inclusive` is false).
 */
export type LimitDirection = 'min' | 'max';

/** A lower-level threshold on the same measurement (an "adjust soon" or an out-of-service level). */
export type Threshold = {
  limit: number;
  inclusive: boolean;
  message: string;
  source: Source;
};

export type Rule = {
  /** Unique within a profile, e.g. "tread_depth.steer", "pushrod_stroke.30L". */
  id: string;
  check: CheckName;
  measurement: MeasurementKind;
  /** The published limit (or, for `common-practice` rules, the habitual one). */
  limit: number;
  direction: LimitDirection;
  /** Whether a value equal to the limit passes. */
  inclusive: boolean;
  /** Severity of a fail. */
  severity: Severity;
  source: Source;
  /** Plain words for the driver: what the rule asks. */
  description: string;
  /** Warning level inside the legal limit ("adjust soon"); the verdict stays `pass`. */
  advisory?: Threshold;
  /**
   * Roadside out-of-service level where it differs from the regulation's limit. A fail that does
   * not reach it is a violation but not an out-of-service condition.
   */
  outOfService?: Threshold;
  /** Extra numbers the check needs, e.g. the pressure span of a build-up test. */
  params?: Readonly<Record<string, number>>;
};

export type RuleProfile = {
  id: ProfileId;
  jurisdiction: Jurisdiction;
  name: string;
  aliases: readonly string[];
  rules: Readonly<Record<string, Rule>>;
};

export type TirePosition = 'steer' | 'drive' | 'trailer';

/**
 * A fleet's own settings. They may tighten a rule, never loosen it: a fleet value that is looser
 * than the profile's limit is ignored (and reported as ignored).
 */
export type FleetSettings = {
  /** Tighter limits keyed by rule id (same unit as the rule), e.g. `{ 'tread_depth.steer': 6 }`. */
  limits?: Readonly<Record<string, number>>;
  /** Cold-pressure targets by position, psi. The higher of this and the measured line's target applies. */
  tirePressureTargets?: Readonly<Partial<Record<TirePosition, number>>>;
  /** Minimum pre-trip duration in minutes (no published minimum exists; 15 is common practice). */
  minimumPretripMinutes?: number;
};

export type EvaluateOptions = {
  /**
   * Profile id or alias ("us", "ca"), or a profile object (e.g. from `customizeProfile`).
   * A `profile` field on the measurement itself wins. Default: us-federal.
   */
  profile?: string | RuleProfile;
  fleet?: FleetSettings;
};

/** The verdict line of `npm run -s evaluate`, plus extra fields. */
export type EvaluationResult = {
  check: CheckName;
  verdict: Verdict;
  severity: Severity | null;
  /** The effective limit that decided the verdict (after fleet tightening), or null when none applies. */
  limit: number | null;
  /** Source of the deciding limit, as one line of text. */
  source: string;
  source_status: SourceStatus | null;
  profile: ProfileId;
  rule: string | null;
  unit: string;
  /** `violation` fails a limit; `out_of_service` also reaches the roadside out-of-service level. */
  level: 'pass' | 'advisory' | 'violation' | 'out_of_service';
  /** Whether the fail reaches the out-of-service level, when the rule knows one; null otherwise. */
  oos: boolean | null;
  advisory: string | null;
  message: string;
  /** Both ends of a two-sided range (governor cut-out), when the check has one. */
  range?: { min: number | null; max: number | null };
  /** Set when the limit was scaled from the measured span (air build-up) rather than read directly. */
  prorated?: boolean;
  /** Set when a fleet limit made the rule stricter than the profile. */
  fleet_tightened?: boolean;
  /** Set when a fleet limit was looser than the published one and so was not applied. */
  fleet_ignored?: boolean;
};

export type EvaluationError = { error: string };

export type EvaluationOutcome = EvaluationResult | EvaluationError;
