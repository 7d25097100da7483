// The locked form of an inspection report: one canonical JSON text whose SHA-256 is stored
// with the report when it is signed, and checked again whenever the report is read.
// Pure: the server hashes the text (node:crypto); nothing here needs Node or a browser.

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
};

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

const iso = (v: Date | string) => (v instanceof Date ? v : new Date(v)).toISOString();

/** Steps in report order, with only the fields that make the record. */
export function toCanonicalSteps(
  steps: ReadonlyArray<
    Omit<CanonicalStep, 'deviceAt' | 'value' | 'score'> & {
      deviceAt: Date | string;
      value: number | string | null;
      score: number | string | null;
    }
  >,
): CanonicalStep[] {
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

/** The one text that is hashed: keys sorted, times in ISO form, steps in order. */
export function serializeReport(report: HeaderSource & { steps: CanonicalStep[] }): string {
  return JSON.stringify(
    sortKeys({
      ...report,
      startedAt: iso(report.startedAt),
      finishedAt: iso(report.finishedAt),
      signedAt: iso(report.signedAt),
      format: 'rigcall-report/1',
    }),
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
