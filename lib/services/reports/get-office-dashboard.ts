import 'server-only';
import vocabulary from '@/grammars/vocabulary.json' with { type: 'json' };
import { getDb } from '@/lib/db';
import type { OfficeDashboard } from '@/lib/schemas/dashboard';
import { listDefectsByWeek, listDurationCounts, listFirstTryByZone, listOpenMajorByDay } from '@/lib/db/dashboard';
import { getFleetMinimumsOrThrow } from './list-reports';
import { getDefaultGrammar } from '@/lib/db/vocabulary';
import { zoneName } from '@/lib/walk';

const vocab = vocabulary as unknown as {
  systems: { id: string; name: string }[];
  components: { id: string; name: string; system: string }[];
};
const systemOfComponent = new Map<string, string>();
for (const c of vocab.components) {
  const system = vocab.systems.find((s) => s.id === c.system)?.name ?? c.system;
  systemOfComponent.set(c.name, system);
  systemOfComponent.set(c.id, system);
}

/** The four trend charts of the office dashboard, as plain series. */
export async function getOfficeDashboard({
  fleetId,
  weeks = 9,
  days = 60,
}: {
  fleetId: string;
  weeks?: number;
  days?: number;
}): Promise<OfficeDashboard> {
  const db = getDb();
  const fleet = await getFleetMinimumsOrThrow(fleetId);
  const [byWeek, openMajor, durations, firstTry] = await Promise.all([
    listDefectsByWeek(db, { fleetId, weeks, timezone: fleet.timezone }),
    listOpenMajorByDay(db, { fleetId, days, timezone: fleet.timezone }),
    listDurationCounts(db, { fleetId, days }),
    listFirstTryByZone(db, { fleetId, days }),
  ]);

  const systems = new Set<string>();
  const weekMap = new Map<string, Record<string, number>>();
  for (const r of byWeek) {
    const system = systemOfComponent.get(r.component) ?? 'other';
    systems.add(system);
    const w = weekMap.get(r.week) ?? {};
    w[system] = (w[system] ?? 0) + r.n;
    weekMap.set(r.week, w);
  }
  const defectsBySystem = [...weekMap.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([week, counts]) => ({ week, ...counts }));

  const maxMinute = Math.max(35, ...durations.map((d) => d.minutes));
  const durationBuckets = Array.from({ length: maxMinute + 1 }, (_, minutes) => ({
    minutes,
    preTrip: durations.find((d) => d.kind === 'pre_trip' && d.minutes === minutes)?.n ?? 0,
    postTrip: durations.find((d) => d.kind === 'post_trip' && d.minutes === minutes)?.n ?? 0,
  }));

  const recognition = firstTry
    .map((z) => {
      const total = z.firstTry + z.confirmed + z.corrected;
      return {
        zone: zoneName(getDefaultGrammar().zones, z.zone),
        total,
        firstTry: z.firstTry,
        confirmed: z.confirmed,
        corrected: z.corrected,
        share: total ? Math.round((z.firstTry / total) * 1000) / 10 : 0,
      };
    })
    .sort((a, b) => a.share - b.share);

  return {
    defectsBySystem,
    systems: [...systems].sort(),
    openMajorByDay: openMajor,
    durationBuckets,
    minimums: { preTrip: fleet.minPretripMinutes, postTrip: fleet.minPosttripMinutes },
    recognition,
  };
}
