import { findProfile } from './rule-profiles';
import type { Jurisdiction, RuleProfile, Severity } from './types';

/**
 * One component–condition pair of the defect vocabulary, as the rules need it. For Canada the
 * severity follows the NSC 13 Schedule 1 minor/major classes; for the US, `major` means the defect
 * must be repaired (or certified as not needing repair) before the unit is driven again,
 * 49 CFR 396.11(a)(3).
 */
export type VocabularyPair = {
  componentId: string;
  conditionId: string;
  severity?: Partial<Record<Jurisdiction, Severity>>;
  source?: string;
};

export type FindingSeverity = {
  severity: Severity;
  /** True when the pair has no severity for this profile: it is treated as major until classified. */
  unclassified: boolean;
  source: string | null;
};

/** `profile`: a profile, or a profile id (`ProfileId`) as stored; an unknown id resolves to none. */
function resolveJurisdiction(profile: RuleProfile | string): Jurisdiction | undefined {
  if (typeof profile === 'object') return profile.jurisdiction;
  return findProfile(profile)?.jurisdiction;
}

/**
 * The severity of a finding under a profile. A pair with no mapping (or an unknown profile) is
 * `major` with `unclassified: true`: the safe side until a trainer classifies it.
 */
export function getFindingSeverity(
  pair: VocabularyPair,
  profile: RuleProfile | string = 'us-federal',
): FindingSeverity {
  const jurisdiction = resolveJurisdiction(profile);
  const severity = jurisdiction === undefined ? undefined : pair.severity?.[jurisdiction];
  if (severity === 'minor' || severity === 'major') {
    return { severity, unclassified: false, source: pair.source ?? null };
  }
  return {
    severity: 'major',
    unclassified: true,
    source: 'not classified yet: treated as major until a trainer classifies it',
  };
}

export type UnclassifiedPair = VocabularyPair & { missing: Jurisdiction[] };

/**
 * Pairs a trainer still has to classify: those with no severity for the profile's jurisdiction,
 * or, without a profile, for either jurisdiction.
 */
export function listUnclassifiedPairs(
  pairs: readonly VocabularyPair[],
  profile?: RuleProfile | string,
): UnclassifiedPair[] {
  const single = profile === undefined ? undefined : resolveJurisdiction(profile);
  const wanted: Jurisdiction[] = single === undefined ? ['us', 'ca'] : [single];
  const result: UnclassifiedPair[] = [];
  for (const pair of pairs) {
    const missing = wanted.filter((j) => {
      const value = pair.severity?.[j];
      return value !== 'minor' && value !== 'major';
    });
    if (missing.length > 0) result.push({ ...pair, missing });
  }
  return result;
}
