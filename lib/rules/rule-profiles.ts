import { COMMON_PRACTICE } from './judge-limit';
import { pushrodStrokeTable } from './pushrod-stroke-table';
import {
  OTHER_DIAMETER_MAX_DEGREES,
  OUT_OF_SERVICE_DEGREES,
  RULE_OF_THUMB_DEGREES,
  convertLashAngleToInches,
  steeringLashTable,
} from './steering-lash-table';
import type { Jurisdiction, ProfileId, Rule, RuleProfile, Source, SourceStatus } from './types';

/*
 * Rule profiles. Every value carries its source and how sure it is. Values marked
 * `from-memory` are unverified and can be corrected with `customizeProfile` (product
 * configuration, not a fleet setting: fleets can only tighten, see `FleetSettings`).
 */

function cite(citation: string, status: SourceStatus): Source {
  return { citation, status };
}

const CDL_AIR_BRAKE = 'CDL manual §5.3 step 7 (air brake check)';
const CVSA_OOS = 'CVSA North American Standard Out-of-Service Criteria';

function indexRules(rules: readonly Rule[]): Record<string, Rule> {
  const byId: Record<string, Rule> = {};
  for (const rule of rules) {
    if (byId[rule.id]) throw new Error(`duplicate rule id ${rule.id}`);
    byId[rule.id] = rule;
  }
  return byId;
}

function buildPushrodRules(jurisdiction: Jurisdiction): Rule[] {
  return pushrodStrokeTable.map((row) => ({
    id: `pushrod_stroke.${row.key}`,
    check: 'pushrod_stroke',
    measurement: 'length_in',
    limit: row.limitIn,
    direction: 'max',
    inclusive: true,
    severity: 'major',
    source:
      jurisdiction === 'us'
        ? cite('49 CFR 393.47(e)', row.status)
        : cite(
            'NSC 13 Schedule 1 Part 1 (pushrod stroke over the adjustment limit: major); limits of the 49 CFR 393.47(e) table',
            'from-memory',
          ),
    description: `Applied pushrod stroke of a ${row.label} chamber must not be over the adjustment limit.`,
    advisory: {
      limit: row.adjustSoonIn,
      inclusive: true,
      message: 'Within the legal limit but close to it: adjust soon',
      source:
        row.adjustSoonSource === 'manitoba'
          ? cite('Manitoba Driving Commercial Vehicles manual (brake adjustment check)', 'verified')
          : cite(COMMON_PRACTICE, 'common-practice'),
    },
  }));
}

function buildSteeringRules(jurisdiction: Jurisdiction): Rule[] {
  const rules: Rule[] = [];
  const caCitation = 'NSC 13 Schedule 1 Part 19 (lash over the prescribed limit: major); limits of 49 CFR 393.209(b)';
  for (const steering of ['manual', 'power'] as const) {
    for (const row of steeringLashTable) {
      const limit = steering === 'manual' ? row.manualIn : row.powerIn;
      const status = steering === 'manual' ? row.manualStatus : row.powerStatus;
      rules.push({
        id: `steering_lash.${steering}.${row.wheelDiameterIn}`,
        check: 'steering_lash',
        measurement: 'length_in',
        limit,
        direction: 'max',
        inclusive: true,
        severity: 'major',
        source: jurisdiction === 'us' ? cite('49 CFR 393.209(b)', status) : cite(caCitation, 'from-memory'),
        description: `Steering lash on a ${row.wheelDiameterIn} in wheel with ${steering} steering must not be over the limit.`,
        advisory: {
          limit: convertLashAngleToInches(row.wheelDiameterIn, RULE_OF_THUMB_DEGREES),
          inclusive: true,
          message: 'More play than the 10 degree rule of thumb: steering may feel loose, have it checked',
          source: cite('CDL manual (steering wheel play rule of thumb)', 'verified'),
        },
        outOfService: {
          limit: convertLashAngleToInches(row.wheelDiameterIn, OUT_OF_SERVICE_DEGREES[steering]),
          inclusive: true,
          message: 'Roadside out-of-service level',
          source: cite(CVSA_OOS, 'from-memory'),
        },
      });
    }
    rules.push({
      id: `steering_lash.${steering}.other`,
      check: 'steering_lash',
      measurement: 'angle_deg',
      limit: OTHER_DIAMETER_MAX_DEGREES[steering],
      direction: 'max',
      inclusive: true,
      severity: 'major',
      source: jurisdiction === 'us' ? cite('49 CFR 393.209(b)(2)', 'from-memory') : cite(caCitation, 'from-memory'),
      description: `Steering lash with ${steering} steering, wheel diameter not in the table: limit is an angle of wheel rotation.`,
      advisory: {
        limit: RULE_OF_THUMB_DEGREES,
        inclusive: true,
        message: 'More play than the 10 degree rule of thumb: steering may feel loose, have it checked',
        source: cite('CDL manual (steering wheel play rule of thumb)', 'verified'),
      },
      outOfService: {
        limit: OUT_OF_SERVICE_DEGREES[steering],
        inclusive: true,
        message: 'Roadside out-of-service level',
        source: cite(CVSA_OOS, 'from-memory'),
      },
    });
  }
  return rules;
}

function buildTreadRules(jurisdiction: Jurisdiction): Rule[] {
  const us = jurisdiction === 'us';
  const caCitation = 'NSC 13 Schedule 1 Part 21 (tread below the wear limit: major)';
  return [
    {
      id: 'tread_depth.steer',
      check: 'tread_depth',
      measurement: 'tread_depth_32nds',
      limit: 4,
      direction: 'min',
      inclusive: true,
      severity: 'major',
      source: us ? cite('49 CFR 393.75(b)', 'verified') : cite(`${caCitation}; 4/32 in on steer tires`, 'from-memory'),
      description: 'Steer tire tread must be at least 4/32 in in a major groove.',
      outOfService: {
        limit: 2,
        inclusive: true,
        message: 'Roadside out-of-service: under 2/32 in in two adjacent major grooves',
        source: cite(CVSA_OOS, 'from-memory'),
      },
    },
    ...(['drive', 'trailer'] as const).map((position): Rule => ({
      id: `tread_depth.${position}`,
      check: 'tread_depth',
      measurement: 'tread_depth_32nds',
      limit: 2,
      direction: 'min',
      inclusive: true,
      severity: 'major',
      source: us ? cite('49 CFR 393.75(c)', 'verified') : cite(`${caCitation}; 2/32 in on other tires`, 'from-memory'),
      description: `${position === 'drive' ? 'Drive' : 'Trailer'} tire tread must be at least 2/32 in in a major groove.`,
      outOfService: {
        limit: 1,
        inclusive: true,
        message: 'Roadside out-of-service: under 1/32 in in two adjacent major grooves',
        source: cite(CVSA_OOS, 'from-memory'),
      },
    })),
  ];
}

function buildTirePressureRules(jurisdiction: Jurisdiction): Rule[] {
  const us = jurisdiction === 'us';
  return [
    {
      id: 'tire_pressure.flat',
      check: 'tire_pressure',
      measurement: 'pressure_fraction',
      limit: 0.5,
      direction: 'min',
      inclusive: false,
      severity: 'major',
      source: us
        ? cite(
            '49 CFR 393.75(a)(3) (flat tire); flat = at or below 50% of the maximum cold inflation pressure (CVSA definition)',
            'verified',
          )
        : cite(
            'NSC 13 Schedule 1 Part 21 (flat tire: major); flat = at or below 50% of the maximum cold inflation pressure (CVSA definition)',
            'verified',
          ),
      description: 'A tire at or below half of its maximum cold inflation pressure is flat.',
    },
    {
      id: 'tire_pressure.target',
      check: 'tire_pressure',
      measurement: 'pressure_fraction',
      limit: 1,
      direction: 'min',
      inclusive: true,
      severity: 'minor',
      source: us
        ? cite(
            "unit's cold-pressure target; 49 CFR 393.75(h)(1) requires at least the load's table pressure",
            'verified',
          )
        : cite("unit's cold-pressure target (fleet setting)", 'common-practice'),
      description: "Cold pressure must be at least the unit's target.",
    },
  ];
}

function buildAirRules(jurisdiction: Jurisdiction): Rule[] {
  const us = jurisdiction === 'us';
  const mtoAir = 'MTO Official Air Brake Handbook (inspecting air brake system operation)';
  const mtoTruck = 'MTO Truck Handbook §6-1-4 (air brake daily inspection)';
  const rules: Rule[] = [
    us
      ? {
          id: 'low_air_warning.min',
          check: 'low_air_warning',
          measurement: 'pressure_psi',
          limit: 60,
          direction: 'min',
          inclusive: true,
          severity: 'major',
          source: cite(`${CDL_AIR_BRAKE}; FMVSS 121 S5.1.5 (49 CFR 571.121)`, 'verified'),
          description: 'The low-air warning must come on before pressure falls below 60 psi.',
        }
      : {
          id: 'low_air_warning.min',
          check: 'low_air_warning',
          measurement: 'pressure_psi',
          limit: 55,
          direction: 'min',
          inclusive: true,
          severity: 'major',
          source: cite(`${mtoAir}; NSC 13 Schedule 1 Part 1 (low-air warning fails: major)`, 'verified'),
          description: 'The low-air warning must have come on by 55 psi (380 kPa).',
          advisory: {
            limit: 60,
            inclusive: true,
            message: 'Most units warn above 60 psi (414 kPa): have the warning checked',
            source: cite(mtoAir, 'verified'),
          },
        },
    {
      id: 'air_buildup.dual',
      check: 'air_buildup',
      measurement: 'duration_s',
      limit: us ? 45 : 120,
      direction: 'max',
      inclusive: true,
      severity: 'minor',
      source: us
        ? cite(
            `${CDL_AIR_BRAKE} (dual system, operating rpm; larger tanks may take longer, check the maker's spec)`,
            'verified',
          )
        : cite(
            'MTO Official Air Brake Handbook §10.3 (600–900 rpm); NSC 13 Schedule 1 Part 1 (slow build-up: minor)',
            'verified',
          ),
      description: us
        ? 'A dual air system should build from 85 to 100 psi within 45 seconds.'
        : 'At 600–900 rpm, pressure should build from 85 to 100 psi within 2 minutes.',
      params: { from: 85, to: 100 },
    },
    {
      id: 'air_buildup.single',
      check: 'air_buildup',
      measurement: 'duration_s',
      limit: 180,
      direction: 'max',
      inclusive: true,
      severity: 'minor',
      source: us
        ? cite(`${CDL_AIR_BRAKE} (single system, 600–900 rpm)`, 'verified')
        : cite(`${CDL_AIR_BRAKE} (single system, 600–900 rpm), applied in the Canadian profile`, 'from-memory'),
      description: 'A single air system should build from 50 to 90 psi within 3 minutes.',
      params: { from: 50, to: 90 },
    },
    {
      id: 'governor_cutout.max',
      check: 'governor_cutout',
      measurement: 'pressure_psi',
      limit: us ? 135 : 145,
      direction: 'max',
      inclusive: true,
      severity: 'minor',
      source: us
        ? cite(
            `${COMMON_PRACTICE} (CDL manual §5.3: cut-out about 125 psi, check the maker's spec; ±10 psi band)`,
            'common-practice',
          )
        : cite(`${mtoTruck}: cut-out never above 145 psi (1000 kPa)`, 'verified'),
      description: us
        ? 'Governor cut-out should be about 125 psi (check the maker\u2019s spec).'
        : 'Governor cut-out must not exceed 145 psi (1000 kPa).',
    },
    {
      id: 'governor_cutout.min',
      check: 'governor_cutout',
      measurement: 'pressure_psi',
      limit: 115,
      direction: 'min',
      inclusive: true,
      severity: 'minor',
      source: cite(
        `${COMMON_PRACTICE} (CDL manual §5.3: cut-out about 125 psi, check the maker's spec; ±10 psi band)`,
        'common-practice',
      ),
      description: 'Governor cut-out should be about 125 psi (check the maker\u2019s spec).',
    },
    us
      ? {
          id: 'governor_cutin.min',
          check: 'governor_cutin',
          measurement: 'pressure_psi',
          limit: 100,
          direction: 'min',
          inclusive: true,
          severity: 'minor',
          source: cite(
            'FMVSS 121 as amended by 61 FR 6173 (1996), vehicles built since 1 Mar 1997; CDL manual §5.3 (about 100 psi)',
            'verified',
          ),
          description: 'The compressor must cut in before pressure falls below 100 psi.',
        }
      : {
          id: 'governor_cutin.min',
          check: 'governor_cutin',
          measurement: 'pressure_psi',
          limit: 80,
          direction: 'min',
          inclusive: true,
          severity: 'minor',
          source: cite(`${mtoTruck}: operating range 80–145 psi`, 'verified'),
          description: 'The compressor must cut in within the 80–145 psi operating range.',
          advisory: {
            limit: 100,
            inclusive: true,
            message:
              'Cut-in below 100 psi: newer vehicles built to the 121 standard cut in at 100 psi or more, check the maker\u2019s spec',
            source: cite('FMVSS/CMVSS 121 cut-in of 100 psi, applied in the Canadian profile', 'from-memory'),
          },
        },
  ];

  // Leakage in one minute. Released: engine off, brakes released, fully charged (strictly under
  // the limit). Applied: engine off, at least 90 psi, pedal held (at most the limit).
  const leak = (
    mode: 'released' | 'applied',
    vehicles: 'single' | 'combination' | 'multiple',
    limit: number,
    source: Source,
  ): Rule => ({
    id: `air_leak.${mode}.${vehicles}`,
    check: 'air_leak',
    measurement: 'pressure_loss_psi_per_min',
    limit,
    direction: 'max',
    inclusive: mode === 'applied',
    severity: 'major',
    source,
    description: `Air loss in one minute, brakes ${mode}, ${
      vehicles === 'single' ? 'single vehicle' : vehicles === 'combination' ? 'combination' : 'three or more vehicles'
    }: ${mode === 'applied' ? 'at most' : 'less than'} ${limit} psi.`,
  });
  const california = 'California DMV Commercial Driver Handbook (three or more vehicles)';
  if (us) {
    rules.push(
      leak('released', 'single', 2, cite(`CDL manual §5.3 (static leakage)`, 'verified')),
      leak('released', 'combination', 3, cite(`CDL manual §5.3 (static leakage)`, 'verified')),
      leak('released', 'multiple', 5, cite(california, 'verified')),
      leak('applied', 'single', 3, cite(`CDL manual §5.3 (applied leakage)`, 'verified')),
      leak('applied', 'combination', 4, cite(`CDL manual §5.3 (applied leakage)`, 'verified')),
      leak('applied', 'multiple', 6, cite(california, 'verified')),
    );
  } else {
    const nsc = 'NSC 13 Schedule 1 Part 1 (air-loss rate over the prescribed limit: major)';
    rules.push(
      leak('released', 'single', 2, cite(`${nsc}; CDL manual static leakage values`, 'from-memory')),
      leak('released', 'combination', 3, cite(`${nsc}; CDL manual static leakage values`, 'from-memory')),
      leak('released', 'multiple', 5, cite(`${nsc}; static leakage value for three or more vehicles`, 'from-memory')),
      leak('applied', 'single', 3, cite(`${mtoTruck}: over 3 psi (21 kPa), single vehicle; ${nsc}`, 'verified')),
      leak(
        'applied',
        'combination',
        4,
        cite(`${mtoTruck}: over 4 psi (28 kPa), tractor and trailer; ${nsc}`, 'verified'),
      ),
      leak('applied', 'multiple', 6, cite(`${nsc}; about 6 psi (41 kPa) with two or more trailers`, 'from-memory')),
    );
  }
  return rules;
}

function buildWindshieldRules(jurisdiction: Jurisdiction): Rule[] {
  const us = jurisdiction === 'us';
  const severity = us ? 'major' : 'minor';
  const ca = (part: string) =>
    cite(
      `NSC 13 Schedule 1 Part 14 (glass: minor); ${part} of 49 CFR 393.60(c) applied in the Canadian profile`,
      'from-memory',
    );
  return [
    {
      id: 'windshield_damage.spot_diameter',
      check: 'windshield_damage',
      measurement: 'length_in',
      limit: 0.75,
      direction: 'max',
      inclusive: true,
      severity,
      source: us ? cite('49 CFR 393.60(c)(3)', 'verified') : ca('3/4 in disc'),
      description: 'A damaged spot in the protected area must be small enough for a 3/4 in disc to cover.',
    },
    {
      id: 'windshield_damage.spot_separation',
      check: 'windshield_damage',
      measurement: 'length_in',
      limit: 3,
      direction: 'min',
      inclusive: true,
      severity,
      source: us ? cite('49 CFR 393.60(c)(3)', 'verified') : ca('3 in spacing'),
      description: 'A damaged spot in the protected area must be at least 3 in from any other.',
    },
    {
      id: 'windshield_damage.crack_width',
      check: 'windshield_damage',
      measurement: 'length_in',
      limit: 0.25,
      direction: 'max',
      inclusive: true,
      severity,
      source: us ? cite('49 CFR 393.60(c)(2)', 'from-memory') : ca('1/4 in crack width'),
      description: 'A single crack in the protected area may be at most 1/4 in wide.',
    },
    {
      id: 'windshield_damage.crack_intersections',
      check: 'windshield_damage',
      measurement: 'count',
      limit: 0,
      direction: 'max',
      inclusive: true,
      severity,
      source: us ? cite('49 CFR 393.60(c)(2)', 'verified') : ca('single-crack rule'),
      description: 'A crack in the protected area must not be intersected by any other crack.',
    },
  ];
}

function buildRearGuardRules(jurisdiction: Jurisdiction): Rule[] {
  const us = jurisdiction === 'us';
  const caNote = 'values of 49 CFR 393.86 applied in the Canadian profile (no Canadian value in the reference)';
  return [
    {
      id: 'rear_impact_guard.since_1998',
      check: 'rear_impact_guard',
      measurement: 'length_in',
      limit: 22,
      direction: 'max',
      inclusive: true,
      severity: 'major',
      source: us ? cite('49 CFR 393.86(a); FMVSS 224', 'verified') : cite(caNote, 'from-memory'),
      description: 'Trailers built on or after 26 Jan 1998: guard ground clearance at most 22 in, unladen.',
    },
    {
      id: 'rear_impact_guard.1953_to_1997',
      check: 'rear_impact_guard',
      measurement: 'length_in',
      limit: 30,
      direction: 'max',
      inclusive: true,
      severity: 'major',
      source: us ? cite('49 CFR 393.86(b)', 'partly-verified') : cite(caNote, 'from-memory'),
      description: 'Trailers built 1953 to 1997: guard bottom at most 30 in above the ground, empty.',
    },
  ];
}

function buildProfile(
  id: ProfileId,
  jurisdiction: Jurisdiction,
  name: string,
  aliases: readonly string[],
): RuleProfile {
  return {
    id,
    jurisdiction,
    name,
    aliases,
    rules: indexRules([
      ...buildTreadRules(jurisdiction),
      ...buildTirePressureRules(jurisdiction),
      ...buildAirRules(jurisdiction),
      ...buildPushrodRules(jurisdiction),
      ...buildSteeringRules(jurisdiction),
      ...buildWindshieldRules(jurisdiction),
      ...buildRearGuardRules(jurisdiction),
    ]),
  };
}

export const usFederalProfile: RuleProfile = buildProfile(
  'us-federal',
  'us',
  'US federal (49 CFR 393/396, CDL manual air-brake checks)',
  ['us', 'us-federal', 'usa', 'fmcsa'],
);

export const caNsc13Profile: RuleProfile = buildProfile(
  'ca-nsc13',
  'ca',
  'Canada (NSC Standard 13 Schedule 1, provincial air-brake values)',
  ['ca', 'ca-nsc13', 'canada', 'nsc13', 'nsc'],
);

export const ruleProfiles: readonly RuleProfile[] = [usFederalProfile, caNsc13Profile];

export const DEFAULT_PROFILE_ID: ProfileId = 'us-federal';

/** Find a profile by id or alias (case-insensitive); the default when `name` is undefined. */
export function findProfile(name: string | undefined): RuleProfile | undefined {
  if (name === undefined) return usFederalProfile;
  const key = name.trim().toLowerCase();
  return ruleProfiles.find((profile) => profile.id === key || profile.aliases.includes(key));
}

export type RuleCorrection = Partial<
  Pick<Rule, 'limit' | 'inclusive' | 'severity' | 'source' | 'advisory' | 'outOfService'>
>;

/**
 * A copy of a profile with some rules corrected: the way to fix a `from-memory` value once it has
 * been checked against the official text. This is product configuration and may move a limit either
 * way; fleets cannot use it (fleet settings only tighten).
 */
export function customizeProfile(
  profile: RuleProfile,
  corrections: Readonly<Record<string, RuleCorrection>>,
): RuleProfile {
  const rules: Record<string, Rule> = { ...profile.rules };
  for (const [id, correction] of Object.entries(corrections)) {
    const rule = rules[id];
    if (!rule) throw new Error(`no rule ${id} in profile ${profile.id}`);
    rules[id] = { ...rule, ...correction };
  }
  return { ...profile, rules };
}

/** Rules whose value is from memory and unverified: the list to check against the official text. */
export function listUnverifiedRules(profile: RuleProfile): Rule[] {
  return Object.values(profile.rules).filter((rule) => rule.source.status === 'from-memory');
}
