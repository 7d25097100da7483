import type { CommandId, MeasureKind, Severity, Unit, ZoneId } from '@/lib/schemas/grammar';

export type MatchKind = 'defect' | 'ok' | 'measurement' | 'command' | 'unknown';

export type RuleProfile = 'us' | 'ca';

/** Where the driver is in the walk; every field is optional. */
export type MatchContext = {
  /** Current zone: findings on its components are preferred, the rest of the vocabulary is the fall-back. */
  zone?: ZoneId | (string & {}) | null;
  /** The measurement the current step asks for, so a bare "one twenty five" becomes 125 psi. */
  measure?: MeasureKind | null;
  /** Component id of the checklist item in front of the driver ("flat" alone then means that item). */
  component?: string | null;
  /** Which severity column to report; default 'us'. */
  profile?: RuleProfile;
};

export type MatchAlternative = {
  termId: string;
  component: string;
  condition: string;
  score: number;
};

export type MatchResult = {
  input: string;
  kind: MatchKind;
  command: CommandId | null;
  component: string | null;
  condition: string | null;
  position: string | null;
  severity: Severity | null;
  value: number | null;
  unit: Unit | null;
  termId: string | null;
  score: number;
  alternatives: MatchAlternative[];
  // fields beyond the stable contract
  componentId: string | null;
  conditionId: string | null;
  system: string | null;
  measure: MeasureKind | null;
  positions: string[];
  severities: { us: Severity; ca: Severity } | null;
  source: string | null;
  /** True when the UI must ask "did you mean …?" before recording. */
  needsConfirmation: boolean;
  /** A finding: the share of the content words it explains (0..1). */
  coverage?: number | null;
  /** Set on an `unknown` result that heard a condition but no component: the question to ask ("what is loose?"). */
  question?: string | null;
};

/** One recogniser alternative, as the browser's SpeechRecognitionAlternative gives it (confidence 0..1, may be absent). */
export type NbestAlternative = { transcript: string; confidence?: number | null };

export type Matcher = {
  match: (text: string, ctx?: MatchContext) => MatchResult;
  matchAlternatives: (alternatives: readonly string[], ctx?: MatchContext) => MatchResult;
  /** The recogniser's n-best list with confidences, combined with the match scores. */
  matchNbest: (alternatives: readonly NbestAlternative[], ctx?: MatchContext) => MatchResult;
  /** Number of distinct spoken phrases the matcher knows (components, conditions, commands). */
  phraseCount: number;
};
