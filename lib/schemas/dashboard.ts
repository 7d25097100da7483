// What the supervisor's home and the trends page receive from the server. Universal.

/** Why a recent report is on the attention list. */
export type AttentionReason = 'major_defect' | 'short' | 'zones_skipped' | 'low_confidence' | 'no_post_trip';

export type AttentionRow = {
  id: string;
  kind: 'pre_trip' | 'post_trip';
  startedAt: string;
  durationS: number | null;
  driverName: string;
  tractorNumber: string;
  trailerNumber: string | null;
  reviewedAt: string | null;
  zonesWalked: number;
  zonesExpected: number;
  lowConfidence: number;
  reasons: AttentionReason[];
};

export type BoardUnit = {
  id: string;
  unitNumber: string;
  kind: 'tractor' | 'trailer';
  status: 'in_service' | 'out_of_service';
  statusChangedAt: string;
  last: {
    id: string;
    kind: 'pre_trip' | 'post_trip';
    startedAt: string;
    driverName: string;
    ageHours: number;
  } | null;
  openMajor: number;
  openMinor: number;
};

/** The supervisor's home: every unit, and the recent reports that need a look. */
export type SupervisorBoard = {
  fleet: { timezone: string; minPretripMinutes: number; minPosttripMinutes: number };
  units: BoardUnit[];
  attention: AttentionRow[];
  days: number;
};

/** The four trend charts of the office dashboard, as plain series. */
export type OfficeDashboard = {
  /** One row a week: `week` (YYYY-MM-DD, the Monday) and a count per system name. */
  defectsBySystem: ({ week: string } & Record<string, number | string>)[];
  systems: string[];
  openMajorByDay: { day: string; open: number }[];
  durationBuckets: { minutes: number; preTrip: number; postTrip: number }[];
  minimums: { preTrip: number; postTrip: number };
  recognition: {
    zone: string;
    total: number;
    firstTry: number;
    confirmed: number;
    corrected: number;
    share: number;
  }[];
};
