import 'server-only';
import { getDb } from '@/lib/db';
import type { SupervisorBoard } from '@/lib/schemas/dashboard';
import { listAttentionRows, listUnitBoardRows } from '@/lib/db/dashboard';
import { LOW_CONFIDENCE } from '../reports/get-report-detail';
import { getFleetMinimumsOrThrow } from '../reports/list-reports';
import { getDefaultGrammar } from '@/lib/db/vocabulary';
import { listWalkZones, type InspectionKind } from '@/lib/walk';

/** Zones per kind and configuration of the default checklists. */
function countZones(kind: InspectionKind) {
  const zones = getDefaultGrammar().zones;
  return {
    withTrailer: listWalkZones(zones, { kind, configuration: 'tractor_trailer' }).length,
    bobtail: listWalkZones(zones, { kind, configuration: 'bobtail' }).length,
  };
}

/** The supervisor's home: the units board and the recent inspections that need a look. */
export async function getSupervisorBoard({
  fleetId,
  days = 14,
  now = new Date(),
}: {
  fleetId: string;
  days?: number;
  now?: Date;
}): Promise<SupervisorBoard> {
  const db = getDb();
  const fleet = await getFleetMinimumsOrThrow(fleetId);
  const [units, attention] = await Promise.all([
    listUnitBoardRows(db, { fleetId }),
    listAttentionRows(db, {
      fleetId,
      days,
      zonesExpected: { pre_trip: countZones('pre_trip'), post_trip: countZones('post_trip') },
      lowConfidence: LOW_CONFIDENCE,
      timezone: fleet.timezone,
      minPretripMinutes: fleet.minPretripMinutes,
      minPosttripMinutes: fleet.minPosttripMinutes,
    }),
  ]);
  return {
    fleet: {
      timezone: fleet.timezone,
      minPretripMinutes: fleet.minPretripMinutes,
      minPosttripMinutes: fleet.minPosttripMinutes,
    },
    units: units.map((u) => ({
      id: u.id,
      unitNumber: u.unitNumber,
      kind: u.kind,
      status: u.status,
      statusChangedAt: u.statusChangedAt.toISOString(),
      last: u.lastId
        ? {
            id: u.lastId,
            kind: u.lastKind!,
            startedAt: u.lastStartedAt!.toISOString(),
            driverName: u.lastDriver!,
            ageHours: Math.round((now.getTime() - u.lastStartedAt!.getTime()) / 360_000) / 10,
          }
        : null,
      openMajor: u.openMajor,
      openMinor: u.openMinor,
    })),
    attention,
    days,
  };
}
