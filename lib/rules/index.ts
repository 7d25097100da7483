/**
 * Public surface of the inspection rules: measured values judged against published limits, finding
 * severities, and report-level computations. Pure: runs in the browser and on the server.
 */
export type {
  CheckName,
  EvaluateOptions,
  EvaluationError,
  EvaluationOutcome,
  EvaluationResult,
  FleetSettings,
  Jurisdiction,
  LimitDirection,
  MeasurementKind,
  ProfileId,
  Rule,
  RuleProfile,
  Severity,
  Source,
  SourceStatus,
  Threshold,
  TirePosition,
  Verdict,
} from './types';

export { CHECK_NAMES, evaluateMeasurement } from './evaluate-measurement';
export { estimateColdPressure } from './check-evaluators';
export {
  DEFAULT_PROFILE_ID,
  caNsc13Profile,
  customizeProfile,
  findProfile,
  listUnverifiedRules,
  ruleProfiles,
  usFederalProfile,
} from './rule-profiles';
export type { RuleCorrection } from './rule-profiles';
export { formatSource, tightenLimit } from './judge-limit';
export { normalizeChamberKey, pushrodStrokeTable } from './pushrod-stroke-table';
export type { PushrodStrokeRow } from './pushrod-stroke-table';
export { convertLashAngleToInches, steeringLashTable } from './steering-lash-table';
export type { SteeringLashRow } from './steering-lash-table';
export { getFindingSeverity, listUnclassifiedPairs } from './finding-severity';
export type { FindingSeverity, UnclassifiedPair, VocabularyPair } from './finding-severity';
export {
  DEFAULT_MINIMUM_PRETRIP_MINUTES,
  checkInspectionCompleteness,
  checkInspectionDuration,
  getReportValidity,
  getUnitServiceStatus,
  isDefectOpen,
  listDefectsToAcknowledge,
} from './report-rules';
export type {
  AcknowledgementDue,
  ChecklistItemState,
  DefectRecord,
  DurationCheck,
  InspectionCompleteness,
  Instant,
  PreviousReport,
  ReportValidity,
  UnitServiceStatus,
  ZoneState,
} from './report-rules';
