import type { SourceStatus } from './types';

/**
 * Brake adjustment limits for clamp-type air brake chambers, 49 CFR 393.47(e) table
 * (as amended by 77 FR 46633, 2012). Applied stroke, engine off, service brake fully applied,
 * 80–90 psi reservoir pressure.
 *
 * Most rows are FROM MEMORY, UNVERIFIED (status `from-memory`): the stored copy of the rule did not
 * show the table text. Correct a row through `customizeProfile` (rule id `pushrod_stroke.<key>`)
 * after checking it against the current eCFR text.
 */
export type PushrodStrokeRow = {
  /** Key used in rule ids and on the command line: "30", "30L", "24L3", "DD3-30". */
  key: string;
  label: string;
  /** Chamber outside diameter, in. */
  outsideDiameterIn: number;
  /** Adjustment limit, in (applied stroke). */
  limitIn: number;
  status: SourceStatus;
  /** "Adjust soon" level below the limit, in, and whether it has a public source. */
  adjustSoonIn: number;
  adjustSoonSource: 'manitoba' | 'common-practice';
};

/** Advisory margin below the limit where no public guidance exists: common practice. */
export const ADJUST_SOON_MARGIN_IN = 0.25;

function defineRow(
  key: string,
  label: string,
  outsideDiameterIn: number,
  limitIn: number,
  status: SourceStatus,
  adjustSoon?: number,
): PushrodStrokeRow {
  return {
    key,
    label,
    outsideDiameterIn,
    limitIn,
    status,
    adjustSoonIn: adjustSoon ?? limitIn - ADJUST_SOON_MARGIN_IN,
    adjustSoonSource: adjustSoon === undefined ? 'common-practice' : 'manitoba',
  };
}

export const pushrodStrokeTable: readonly PushrodStrokeRow[] = [
  defineRow('6', 'type 6', 4.5, 1.25, 'from-memory'),
  defineRow('9', 'type 9', 5.25, 1.375, 'from-memory'),
  defineRow('12', 'type 12', 5 + 11 / 16, 1.375, 'partly-verified'),
  defineRow('12L', 'type 12 long stroke', 5 + 11 / 16, 1.75, 'partly-verified'),
  defineRow('16', 'type 16', 6.375, 1.75, 'partly-verified'),
  defineRow('16L', 'type 16 long stroke', 6.375, 2, 'verified'),
  defineRow('20', 'type 20', 6 + 25 / 32, 1.75, 'verified'),
  defineRow('20L', 'type 20 long stroke', 6 + 25 / 32, 2, 'verified'),
  defineRow('24', 'type 24', 7 + 7 / 32, 1.75, 'from-memory'),
  defineRow('24L', 'type 24 long stroke', 7 + 7 / 32, 2, 'verified'),
  defineRow('24L3', 'type 24 long stroke, 3 in rated stroke', 7 + 7 / 32, 2.5, 'verified'),
  // Manitoba Driving Commercial Vehicles manual: adjust a type 30 when applied stroke is over 1-3/4 in.
  defineRow('30', 'type 30', 8 + 3 / 32, 2, 'from-memory', 1.75),
  defineRow('30L', 'type 30 long stroke', 8 + 3 / 32, 2.5, 'verified'),
  defineRow('36', 'type 36', 9, 2.25, 'from-memory'),
  // Same paragraph, other actuator family (from memory, unverified).
  defineRow('DD3-30', 'DD-3 type 30', 8 + 3 / 32, 2.25, 'from-memory'),
];

/**
 * Normalise a chamber marking as spoken or typed ("30", "30L", "30LS", "type 30 long stroke",
 * "24L3", "24 LS 3 in", "DD-3") to a table key, or null when it is not in the table.
 * A chamber with no long-stroke marking is treated as standard.
 */
export function normalizeChamberKey(raw: string): string | null {
  let text = raw
    .toUpperCase()
    .replace(/TYPE/g, '')
    .replace(/LONG\s*STROKE/g, 'L');
  text = text.replace(/[\s\-_.]/g, '');
  if (/^DD3(30)?$/.test(text)) return 'DD3-30';
  const match = /^(\d{1,2})(LS?)?(3(IN)?|3INCH)?$/.exec(text);
  if (!match) return null;
  const size = match[1];
  const long = match[2] !== undefined;
  const threeInch = match[3] !== undefined;
  if (threeInch && !long) return null;
  const key = `${size}${long ? 'L' : ''}${threeInch ? '3' : ''}`;
  return pushrodStrokeTable.some((row) => row.key === key) ? key : null;
}
