import 'server-only';
import { sql, type Selectable } from 'kysely';
import type { Inspection, Unit } from '@/db/schema';
import type { AttentionReason, AttentionRow } from '@/lib/schemas/dashboard';
import type { DB } from './index';

/** Every unit with its status, last inspection and open defects, for the supervisor's board. */
export async function listUnitBoardRows(db: DB, { fleetId }: { fleetId: string }) {
  const rows = await sql<{
    id: string;
    unitNumber: string;
    kind: Unit['kind'];
    status: Selectable<Unit>['status'];
    statusChangedAt: Date;
    lastId: string | null;
    lastKind: Inspection['kind'] | null;
    lastStartedAt: Date | null;
    lastDriver: string | null;
    openMajor: number;
    openMinor: number;
  }>`
    SELECT u.id, u.unit_number, u.kind, u.status, u.status_changed_at,
           last.id AS last_id, last.kind AS last_kind, last.started_at AS last_started_at, last.driver AS last_driver,
           (SELECT count(*) FROM defect df WHERE df.unit_id = u.id AND df.status = 'open' AND df.severity = 'major')::int AS open_major,
           (SELECT count(*) FROM defect df WHERE df.unit_id = u.id AND df.status = 'open' AND df.severity = 'minor')::int AS open_minor
    FROM unit u
    LEFT JOIN LATERAL (
      SELECT i.id, i.kind, i.started_at, d.name AS driver
      FROM inspection i JOIN app_user d ON d.id = i.driver_id
      WHERE i.fleet_id = u.fleet_id AND (i.tractor_id = u.id OR i.trailer_id = u.id) AND i.status = 'submitted'
      ORDER BY i.started_at DESC LIMIT 1
    ) last ON true
    WHERE u.fleet_id = ${fleetId} AND u.retired_at IS NULL
    ORDER BY u.status = 'out_of_service' DESC, u.kind, u.unit_number`.execute(db);
  return rows.rows;
}

/**
 * Submitted reports of the last `days` days that need a look, with their reasons: a major
 * defect, shorter than the fleet minimum, fewer zones than the configuration has, a
 * low-confidence finding accepted without the driver confirming it, or a pre-trip whose day has
 * no post-trip by the same driver on the same tractor.
 */
export async function listAttentionRows(
  db: DB,
  a: {
    fleetId: string;
    days: number;
    /** How many zones each kind of walk has, per configuration (from lib/walk listWalkZones). */
    zonesExpected: Record<'pre_trip' | 'post_trip', { withTrailer: number; bobtail: number }>;
    lowConfidence: number;
    timezone: string;
    minPretripMinutes: number;
    minPosttripMinutes: number;
  },
) {
  const rows = await sql<{
    id: string;
    kind: Inspection['kind'];
    startedAt: Date;
    durationS: number | null;
    driverName: string;
    tractorNumber: string;
    trailerNumber: string | null;
    reviewedAt: Date | null;
    major: boolean;
    short: boolean;
    zonesWalked: number;
    zonesExpected: number;
    lowConfidence: number;
    noPostTrip: boolean;
  }>`
    WITH recent AS (
      SELECT i.* FROM inspection i
      WHERE i.fleet_id = ${a.fleetId} AND i.status = 'submitted' AND i.started_at > now() - make_interval(days => ${a.days}::int)
    ), scored AS (
      SELECT r.id, r.kind, r.started_at, r.duration_s, d.name AS driver_name, t.unit_number AS tractor_number, tr.unit_number AS trailer_number, r.reviewed_at,
        EXISTS (SELECT 1 FROM defect df WHERE df.inspection_id = r.id AND df.severity = 'major') AS major,
        COALESCE(r.duration_s < (CASE WHEN r.kind = 'pre_trip' THEN ${a.minPretripMinutes}::int ELSE ${a.minPosttripMinutes}::int END) * 60, false) AS short,
        (SELECT count(DISTINCT s.zone) FROM inspection_step s WHERE s.inspection_id = r.id)::int AS zones_walked,
        (CASE
          WHEN r.kind = 'post_trip' AND r.trailer_id IS NULL THEN ${a.zonesExpected.post_trip.bobtail}::int
          WHEN r.kind = 'post_trip' THEN ${a.zonesExpected.post_trip.withTrailer}::int
          WHEN r.trailer_id IS NULL THEN ${a.zonesExpected.pre_trip.bobtail}::int
          ELSE ${a.zonesExpected.pre_trip.withTrailer}::int END) AS zones_expected,
        (SELECT count(*) FROM inspection_step s WHERE s.inspection_id = r.id AND s.kind = 'defect' AND s.score < ${a.lowConfidence} AND s.resolution = 'auto')::int AS low_confidence,
        (r.kind = 'pre_trip'
          AND (r.started_at AT TIME ZONE ${a.timezone})::date < (now() AT TIME ZONE ${a.timezone})::date
          AND NOT EXISTS (
            SELECT 1 FROM inspection p WHERE p.fleet_id = r.fleet_id AND p.kind = 'post_trip' AND p.driver_id = r.driver_id AND p.tractor_id = r.tractor_id
              AND (p.started_at AT TIME ZONE ${a.timezone})::date = (r.started_at AT TIME ZONE ${a.timezone})::date)) AS no_post_trip
      FROM recent r
      JOIN app_user d ON d.id = r.driver_id
      JOIN unit t ON t.id = r.tractor_id
      LEFT JOIN unit tr ON tr.id = r.trailer_id
    )
    SELECT * FROM scored
    WHERE major OR short OR zones_walked < zones_expected OR low_confidence > 0 OR no_post_trip
    ORDER BY reviewed_at IS NOT NULL, major DESC, started_at DESC
    LIMIT 60`.execute(db);
  return rows.rows.map((r): AttentionRow => {
    const reasons: AttentionReason[] = [];
    if (r.major) reasons.push('major_defect');
    if (r.short) reasons.push('short');
    if (r.zonesWalked < r.zonesExpected) reasons.push('zones_skipped');
    if (r.lowConfidence > 0) reasons.push('low_confidence');
    if (r.noPostTrip) reasons.push('no_post_trip');
    return {
      id: r.id,
      kind: r.kind,
      startedAt: r.startedAt.toISOString(),
      durationS: r.durationS,
      driverName: r.driverName,
      tractorNumber: r.tractorNumber,
      trailerNumber: r.trailerNumber,
      reviewedAt: r.reviewedAt ? r.reviewedAt.toISOString() : null,
      zonesWalked: r.zonesWalked,
      zonesExpected: r.zonesExpected,
      lowConfidence: r.lowConfidence,
      reasons,
    };
  });
}

/** Defects by week and component over the last `weeks` weeks (component → system mapped by the caller). */
export async function listDefectsByWeek(
  db: DB,
  { fleetId, weeks, timezone }: { fleetId: string; weeks: number; timezone: string },
) {
  const r = await sql<{ week: string; component: string; n: number }>`
    SELECT to_char(date_trunc('week', df.created_at AT TIME ZONE ${timezone}), 'YYYY-MM-DD') AS week, df.component, count(*)::int AS n
    FROM defect df
    WHERE df.fleet_id = ${fleetId} AND df.created_at > now() - make_interval(weeks => ${weeks}::int)
    GROUP BY 1, 2 ORDER BY 1`.execute(db);
  return r.rows;
}

/** Major defects open at the end of each day of the last `days` days. */
export async function listOpenMajorByDay(
  db: DB,
  { fleetId, days, timezone }: { fleetId: string; days: number; timezone: string },
) {
  const r = await sql<{ day: string; open: number }>`
    SELECT to_char(g.day, 'YYYY-MM-DD') AS day,
      (SELECT count(*) FROM defect df
        WHERE df.fleet_id = ${fleetId} AND df.severity = 'major'
          AND df.created_at < ((g.day + 1)::timestamp AT TIME ZONE ${timezone})
          AND (df.certified_at IS NULL OR df.certified_at >= ((g.day + 1)::timestamp AT TIME ZONE ${timezone})))::int AS open
    FROM (SELECT (now() AT TIME ZONE ${timezone})::date - n AS day FROM generate_series(0, ${days}::int) AS n) AS g
    ORDER BY 1`.execute(db);
  return r.rows;
}

/** Submitted inspections of the last `days` days by kind and whole minutes taken. */
export async function listDurationCounts(db: DB, { fleetId, days }: { fleetId: string; days: number }) {
  const r = await sql<{ kind: string; minutes: number; n: number }>`
    SELECT kind, floor(duration_s / 60.0)::int AS minutes, count(*)::int AS n
    FROM inspection
    WHERE fleet_id = ${fleetId} AND status = 'submitted' AND duration_s IS NOT NULL AND started_at > now() - make_interval(days => ${days}::int)
    GROUP BY 1, 2 ORDER BY 1, 2`.execute(db);
  return r.rows;
}

/** Spoken findings per zone: how many matched on the first try (accepted as heard) and how many needed a confirm or a correction. */
export async function listFirstTryByZone(db: DB, { fleetId, days }: { fleetId: string; days: number }) {
  const r = await sql<{ zone: string; firstTry: number; confirmed: number; corrected: number }>`
    SELECT s.zone,
      count(*) FILTER (WHERE s.resolution = 'auto')::int AS first_try,
      count(*) FILTER (WHERE s.resolution = 'confirmed')::int AS confirmed,
      count(*) FILTER (WHERE s.resolution = 'corrected')::int AS corrected
    FROM inspection_step s
    JOIN inspection i ON i.id = s.inspection_id
    WHERE s.fleet_id = ${fleetId} AND s.kind IN ('defect', 'measurement') AND s.input_mode = 'voice' AND s.resolution IS NOT NULL
      AND i.started_at > now() - make_interval(days => ${days}::int)
    GROUP BY 1`.execute(db);
  return r.rows;
}
