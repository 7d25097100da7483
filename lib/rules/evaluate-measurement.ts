import { checkEvaluators } from './check-evaluators';
import { findProfile } from './rule-profiles';
import type { CheckName, EvaluateOptions, EvaluationOutcome, FleetSettings, RuleProfile } from './types';

export const CHECK_NAMES = Object.keys(checkEvaluators) as CheckName[];

function isCheckName(value: string): value is CheckName {
  return Object.prototype.hasOwnProperty.call(checkEvaluators, value);
}

function readFleet(value: unknown): FleetSettings | { error: string } | undefined {
  if (value === undefined || value === null) return undefined;
  if (typeof value !== 'object' || Array.isArray(value)) return { error: '"fleet" must be an object' };
  return value;
}

/**
 * Judge one measurement, e.g. `{ check: 'tread_depth', position: 'steer', value: 3 }`, against a
 * rule profile and the fleet's (tightening) settings. Never throws: input it cannot judge gets
 * `{ error }`.
 */
export function evaluateMeasurement(input: unknown, options: EvaluateOptions = {}): EvaluationOutcome {
  try {
    if (typeof input !== 'object' || input === null || Array.isArray(input)) {
      return { error: 'a measurement must be a JSON object with a "check" field' };
    }
    const fields = input as Record<string, unknown>;
    const check = fields.check;
    if (check === undefined) return { error: 'missing field "check"' };
    if (typeof check !== 'string' || !isCheckName(check)) {
      const shown = typeof check === 'string' ? JSON.stringify(check.slice(0, 40)) : String(typeof check);
      return { error: `unknown check ${shown}: known checks are ${CHECK_NAMES.join(', ')}` };
    }

    let profile: RuleProfile | undefined;
    if (fields.profile !== undefined) {
      if (typeof fields.profile !== 'string') return { error: '"profile" must be a profile name such as "us" or "ca"' };
      profile = findProfile(fields.profile);
      if (!profile)
        return {
          error: `unknown profile ${JSON.stringify(fields.profile.slice(0, 40))}: use "us-federal" (us) or "ca-nsc13" (ca)`,
        };
    } else if (typeof options.profile === 'object') {
      profile = options.profile;
    } else {
      profile = findProfile(options.profile);
      if (!profile) return { error: `unknown profile ${JSON.stringify(options.profile)}` };
    }

    const fleet = options.fleet ?? readFleet(fields.fleet);
    if (fleet && 'error' in fleet) return { error: String(fleet.error) };

    return checkEvaluators[check](fields, { profile, fleet });
  } catch (cause) {
    return { error: `internal error: ${cause instanceof Error ? cause.message : String(cause)}` };
  }
}
