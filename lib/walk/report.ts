// The locked form of an inspection report: one canonical JSON text whose SHA-256 is stored
// with the report when it is signed, and checked again whenever the report is read. Format 2
// covers every step (with the server's receive time), every photo's SHA-256 and the drawn
// signature's SHA-256; format 1 (reports signed before it) covered the steps and header only.
import { sha256Hex } from './sha256';

/** The sentence the driver signs under. */
export const certificationStatement =
  'I performed this inspection and the report lists every defect I found or that was reported to me.';

export const REPORT_FORMAT = 2;

/**
 * Whether a typed signature names the signed-in account: the same words, whatever the case and
 * spacing. Reports, acknowledgements and repair certifications are signed only this way.
 */
export function isSameSignerName(typed: string, accountName: string): boolean {
  const norm = (s: string) => s.trim().replace(/\s+/g, ' ').toLowerCase();
  return norm(typed) === norm(accountName);
}

/** The refusal a person sees when the typed name is not the account's. */
export const signerNameMessage = (accountName: string) =>
  `Sign with your name as it is on your account: ${accountName}.`;

export type CanonicalStep = {
  id: string;
  seq: number;
  zone: string;
  item: string | null;
  kind: string;
  heard: string | null;
  termKey: string | null;
  component: string | null;
  condition: string | null;
  position: string | null;
  score: number | null;
  resolution: string | null;
  undoesStepId: string | null;
  measurementKind: string | null;
  value: number | null;
  unit: string | null;
  verdict: string | null;
  severity: string | null;
  deviceAt: string;
  /** Format 2: when the server heard it, and why an item was not checked. */
  serverAt?: string;
  notCheckedReason?: string | null;
  note?: string | null;
};

export type CanonicalPhoto = { id: string; stepId: string | null; sha256: string };

export type CanonicalReport = {
  id: string;
  fleetId: string;
  kind: string;
  driverId: string;
  tractorId: string;
  trailerId: string | null;
  odometer: number | null;
  location: string | null;
  billOfLading: string | null;
  sealNumber: string | null;
  ruleProfile: string;
  vocabularyVersionId: string | null;
  startedAt: string;
  finishedAt: string;
  certificationText: string;
  signatureName: string;
  signedAt: string;
  steps: CanonicalStep[];
};

type StepRow = Omit<CanonicalStep, 'deviceAt' | 'value' | 'score' | 'serverAt'> & {
  deviceAt: Date | string;
  serverAt?: Date | string;
  value: number | string | null;
  score: number | string | null;
};

const iso = (v: Date | string) => (v instanceof Date ? v : new Date(v)).toISOString();

/** Steps in report order, with only the fields that make the record. */
export function toCanonicalSteps(steps: readonly StepRow[], format: number = REPORT_FORMAT): CanonicalStep[] {
  return [...steps]
    .sort((a, b) => a.seq - b.seq || a.id.localeCompare(b.id))
    .map((s) => ({
      id: s.id,
      seq: s.seq,
      zone: s.zone,
      item: s.item,
      kind: s.kind,
      heard: s.heard,
      termKey: s.termKey,
      component: s.component,
      condition: s.condition,
      position: s.position,
      score: s.score === null ? null : Math.round(Number(s.score) * 1000) / 1000,
      resolution: s.resolution,
      undoesStepId: s.undoesStepId,
      measurementKind: s.measurementKind,
      value: s.value === null ? null : Number(s.value),
      unit: s.unit,
      verdict: s.verdict,
      severity: s.severity,
      deviceAt: iso(s.deviceAt),
      ...(format >= 2
        ? {
            serverAt: s.serverAt ? iso(s.serverAt) : iso(s.deviceAt),
            notCheckedReason: s.notCheckedReason ?? null,
            note: s.note ?? null,
          }
        : {}),
    }));
}

function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.keys(value as Record<string, unknown>)
        .sort()
        .map((k) => [k, sortKeys((value as Record<string, unknown>)[k])]),
    );
  }
  return value;
}

export type ReportEvidence = {
  /** Every photo of the report, with the SHA-256 of its stored bytes. */
  photos: readonly CanonicalPhoto[];
  /** The SHA-256 of the stored drawn signature, or null when none was drawn. */
  signatureSha256: string | null;
};

/** The one text that is hashed: keys sorted, times in ISO form, steps and photos in order. */
export function serializeReport(
  report: HeaderSource & { steps: CanonicalStep[] },
  evidence: ReportEvidence | null = null,
  format: number = REPORT_FORMAT,
): string {
  const base = {
    ...report,
    startedAt: iso(report.startedAt),
    finishedAt: iso(report.finishedAt),
    signedAt: iso(report.signedAt),
  };
  if (format < 2) return JSON.stringify(sortKeys({ ...base, format: 'rigcall-report/1' }));
  return JSON.stringify(
    sortKeys({
      ...base,
      photos: [...(evidence?.photos ?? [])]
        .sort((a, b) => a.id.localeCompare(b.id))
        .map((p) => ({ id: p.id, stepId: p.stepId, sha256: p.sha256 })),
      signatureSha256: evidence?.signatureSha256 ?? null,
      format: 'rigcall-report/2',
    }),
  );
}

/** The report's content hash: the SHA-256 of its canonical text. */
export function hashReport(
  header: HeaderSource,
  steps: readonly StepRow[],
  evidence: ReportEvidence | null,
  format: number = REPORT_FORMAT,
): string {
  return sha256Hex(
    serializeReport({ ...pickReportHeader(header), steps: toCanonicalSteps(steps, format) }, evidence, format),
  );
}

type Moment = Date | string;
type HeaderSource = Omit<CanonicalReport, 'steps' | 'startedAt' | 'finishedAt' | 'signedAt'> & {
  startedAt: Moment;
  finishedAt: Moment;
  signedAt: Moment;
};

/** The header fields that make the record, from any row or object that carries them. */
export function pickReportHeader(h: HeaderSource): HeaderSource {
  return {
    id: h.id,
    fleetId: h.fleetId,
    kind: h.kind,
    driverId: h.driverId,
    tractorId: h.tractorId,
    trailerId: h.trailerId,
    odometer: h.odometer,
    location: h.location,
    billOfLading: h.billOfLading,
    sealNumber: h.sealNumber,
    ruleProfile: h.ruleProfile,
    vocabularyVersionId: h.vocabularyVersionId,
    startedAt: h.startedAt,
    finishedAt: h.finishedAt,
    certificationText: h.certificationText,
    signatureName: h.signatureName,
    signedAt: h.signedAt,
  };
}
