import { COMMON_PRACTICE } from './judge-limit';
import { findProfile } from './rule-profiles';
import type { FleetSettings, RuleProfile, Severity } from './types';

/** A point in time: epoch milliseconds, an ISO string, or a Date. */
export type Instant = number | string | Date;

function toMillis(value: Instant): number {
  return value instanceof Date ? value.getTime() : typeof value === 'number' ? value : Date.parse(value);
}

/** A defect as the report rules need it. */
export type DefectRecord = {
  id: string;
  /** The tractor or trailer the defect is on. */
  unitId: string;
  severity: Severity;
  description?: string;
  /**
   * The mechanic's certification (49 CFR 396.11(a)(3)): repaired, or repair unnecessary.
   * Absent or null while the defect is open.
   */
  repair?: { outcome: 'repaired' | 'repair_unnecessary'; certifiedAt: Instant; certifiedBy?: string } | null;
};

export function isDefectOpen(defect: DefectRecord): boolean {
  return defect.repair === undefined || defect.repair === null;
}

export type UnitServiceStatus = {
  outOfService: boolean;
  openMajor: DefectRecord[];
  openMinor: DefectRecord[];
};

/**
 * A unit is out of service while any major defect on it is open (no repair certification).
 * Pass all defects of the fleet or of one unit; only those with `unitId` count.
 */
export function getUnitServiceStatus(unitId: string, defects: readonly DefectRecord[]): UnitServiceStatus {
  const open = defects.filter((defect) => defect.unitId === unitId && isDefectOpen(defect));
  const openMajor = open.filter((defect) => defect.severity === 'major');
  return {
    outOfService: openMajor.length > 0,
    openMajor,
    openMinor: open.filter((defect) => defect.severity === 'minor'),
  };
}

export type ChecklistItemState = {
  id: string;
  required: boolean;
  /** null while not answered. */
  answer: 'ok' | 'defect' | 'not_applicable' | null;
};

export type ZoneState = { id: string; visited: boolean; items: readonly ChecklistItemState[] };

export type InspectionCompleteness = {
  complete: boolean;
  unvisitedZones: string[];
  /** Required items with no answer, as `{ zoneId, itemId }`. */
  unansweredItems: Array<{ zoneId: string; itemId: string }>;
};

/** An inspection is complete only when every zone was visited and every required item answered. */
export function checkInspectionCompleteness(zones: readonly ZoneState[]): InspectionCompleteness {
  const unvisitedZones = zones.filter((zone) => !zone.visited).map((zone) => zone.id);
  const unansweredItems = zones.flatMap((zone) =>
    zone.items
      .filter((item) => item.required && item.answer === null)
      .map((item) => ({ zoneId: zone.id, itemId: item.id })),
  );
  return { complete: unvisitedZones.length === 0 && unansweredItems.length === 0, unvisitedZones, unansweredItems };
}

/** No regulation sets a minimum pre-trip time; 15 minutes is common practice (carrier policy). */
export const DEFAULT_MINIMUM_PRETRIP_MINUTES = 15;

export type DurationCheck = {
  minutes: number;
  minimumMinutes: number;
  /** Shorter than the minimum: flag it for the supervisor. */
  short: boolean;
  source: string;
};

/**
 * Inspection time against the fleet minimum (default 15 minutes, common practice; no published
 * minimum exists, so a fleet may set any value). The real time taken is on-duty time (49 CFR 395.2).
 */
export function checkInspectionDuration(
  startedAt: Instant,
  finishedAt: Instant,
  fleet?: Pick<FleetSettings, 'minimumPretripMinutes'>,
): DurationCheck {
  const fleetMinimum = fleet?.minimumPretripMinutes;
  const usable = fleetMinimum !== undefined && Number.isFinite(fleetMinimum) && fleetMinimum >= 0;
  const minimumMinutes = usable ? fleetMinimum : DEFAULT_MINIMUM_PRETRIP_MINUTES;
  const elapsed = (toMillis(finishedAt) - toMillis(startedAt)) / 60_000;
  const minutes = Number.isFinite(elapsed) ? Math.max(0, elapsed) : 0;
  return {
    minutes,
    minimumMinutes,
    short: minutes < minimumMinutes,
    source: usable ? 'fleet setting (no published minimum)' : `${COMMON_PRACTICE} (15 minutes)`,
  };
}

export type ReportValidity = {
  /** Whether the report still covers the unit at `now`. */
  valid: boolean;
  /** End of validity, epoch ms; null when the profile sets no fixed period. */
  validUntil: number | null;
  source: string;
};

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * Canadian profile: a trip inspection report is valid for 24 hours from the inspection time
 * (NSC 13). US profile: no fixed period; a pre-trip is owed before each day's driving
 * (49 CFR 396.13) and a report at the end of each day's work (396.11), so validity is not timed.
 */
export function getReportValidity(profile: RuleProfile | string, inspectedAt: Instant, now: Instant): ReportValidity {
  const resolved = typeof profile === 'object' ? profile : findProfile(profile);
  const start = toMillis(inspectedAt);
  const at = toMillis(now);
  if (resolved?.jurisdiction === 'ca') {
    const validUntil = start + DAY_MS;
    return {
      valid: Number.isFinite(start) && at >= start && at < validUntil,
      validUntil: Number.isFinite(validUntil) ? validUntil : null,
      source: 'NSC 13 trip inspection: report valid for 24 hours',
    };
  }
  return {
    valid: Number.isFinite(start) && at >= start,
    validUntil: null,
    source: '49 CFR 396.11 / 396.13: no fixed validity period',
  };
}

export type PreviousReport = {
  id: string;
  /** Units inspected on that report (tractor and trailers). */
  unitIds: readonly string[];
  defects: readonly DefectRecord[];
};

export type AcknowledgementDue = {
  /** Defects the next driver must review and sign for. */
  mustAcknowledge: DefectRecord[];
  /** Of those, the ones without a repair certification: the driver must not operate the unit. */
  uncertified: DefectRecord[];
  /** Whether a review signature is required at all. */
  signatureRequired: boolean;
  /**
   * US: false while any listed defect lacks its certification (FMCSA guidance to 396.13, Q1).
   * Canada: false while a major defect is open (a minor defect may be driven on, NSC 13).
   */
  mayOperate: boolean;
  source: string;
};

/**
 * Which defects of the unit's last report the next driver must acknowledge before driving,
 * 49 CFR 396.13: review the last report and sign it when defects were listed. Defects on a towed
 * unit that is no longer in the combination need no signature.
 */
export function listDefectsToAcknowledge(
  previous: PreviousReport | null | undefined,
  currentUnitIds: readonly string[],
  profile: RuleProfile | string = 'us-federal',
): AcknowledgementDue {
  const jurisdiction = (typeof profile === 'object' ? profile : findProfile(profile))?.jurisdiction ?? 'us';
  const source = jurisdiction === 'ca' ? 'NSC 13 (later drivers sign a valid report); 49 CFR 396.13' : '49 CFR 396.13';
  if (!previous) return { mustAcknowledge: [], uncertified: [], signatureRequired: false, mayOperate: true, source };
  const current = new Set(currentUnitIds);
  const mustAcknowledge = previous.defects.filter((defect) => current.has(defect.unitId));
  const uncertified = mustAcknowledge.filter(isDefectOpen);
  return {
    mustAcknowledge,
    uncertified,
    signatureRequired: mustAcknowledge.length > 0,
    mayOperate:
      jurisdiction === 'ca' ? !uncertified.some((defect) => defect.severity === 'major') : uncertified.length === 0,
    source,
  };
}
