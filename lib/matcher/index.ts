export { ACCEPT_THRESHOLD, CONFIRM_THRESHOLD, createMatcher } from './create-matcher';
export { getDefaultMatcher } from './default-matcher';
export { createNormalizer, MAX_INPUT_CHARS } from './normalize-text';
export { createQuantityReader } from './read-quantities';
export { getPhoneticKey } from './phonetic-key';
export type { Quantity } from './read-quantities';
export type {
  MatchAlternative,
  MatchContext,
  MatchKind,
  MatchResult,
  Matcher,
  NbestAlternative,
  RuleProfile,
} from './types';

import { getDefaultMatcher } from './default-matcher';
import type { MatchContext, MatchResult } from './types';

/** Match one utterance against the default grammars. */
export function matchUtterance(text: string, ctx?: MatchContext): MatchResult {
  return getDefaultMatcher().match(text, ctx);
}

/** Match the recogniser's alternatives for one utterance (best reading over all of them). */
export function matchAlternatives(alternatives: readonly string[], ctx?: MatchContext): MatchResult {
  return getDefaultMatcher().matchAlternatives(alternatives, ctx);
}
