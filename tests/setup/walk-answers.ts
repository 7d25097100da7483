import { randomUUID } from 'node:crypto';
import zonesGrammar from '@/grammars/zones.json' with { type: 'json' };
import type { Zones } from '@/lib/schemas/grammar';
import type { DB } from '../../db/connect';
import { configurationOf, DEFAULT_REQUIRED_READINGS, listWalkZones, type InspectionKind } from '@/lib/walk';

/**
 * Readings that pass the default rule profile, one per required air-brake test:
 * CDL manual §5.3 (build-up 85→100 psi within 45 s, cut-out about 125 psi, cut-in about 100 psi,
 * leakage of a single vehicle under 2 psi/min released and 3 psi/min applied, low-air warning
 * before 60 psi).
 */
const passing: Record<string, number> = {
  air_buildup: 30,
  governor_cutout: 125,
  governor_cutin: 105,
  air_leak: 1,
  low_air_warning: 62,
};

/**
 * Step bodies that answer every item a fleet with default settings requires: "all good" for each
 * zone's visual items and a passing number for each required reading.
 */
export function answerEveryItem({
  kind,
  hasTrailer,
  fromSeq,
  skipZones = [],
}: {
  kind: InspectionKind;
  hasTrailer: boolean;
  fromSeq: number;
  skipZones?: string[];
}): Record<string, unknown>[] {
  let seq = fromSeq;
  const out: Record<string, unknown>[] = [];
  for (const zone of listWalkZones(zonesGrammar as Zones, { kind, configuration: configurationOf(hasTrailer) })) {
    if (skipZones.includes(zone.id)) continue;
    out.push({ id: randomUUID(), seq: seq++, zone: zone.id, kind: 'zone_ok', inputMode: 'tap' });
    if (kind !== 'pre_trip') continue;
    for (const item of zone.items)
      if (item.measure && DEFAULT_REQUIRED_READINGS.includes(item.measure))
        out.push({
          id: randomUUID(),
          seq: seq++,
          zone: zone.id,
          item: item.id,
          kind: 'measurement',
          inputMode: 'typed',
          reading: { value: passing[item.measure] },
        });
  }
  return out;
}

/** The same answers written straight into the database, for a draft made by a factory. */
export async function answerEveryItemInDb(
  db: DB,
  i: { fleetId: string; inspectionId: string; kind: InspectionKind; hasTrailer: boolean },
) {
  const rows = answerEveryItem({ kind: i.kind, hasTrailer: i.hasTrailer, fromSeq: 0 }).map((b) => ({
    id: b.id as string,
    fleetId: i.fleetId,
    inspectionId: i.inspectionId,
    seq: b.seq as number,
    zone: b.zone as string,
    item: (b.item as string | undefined) ?? null,
    kind: b.kind as 'zone_ok' | 'measurement',
    inputMode: 'tap' as const,
    value: (b.reading as { value: number } | undefined)?.value ?? null,
    verdict: b.kind === 'measurement' ? ('pass' as const) : null,
    deviceAt: new Date(),
  }));
  await db.insertInto('inspectionStep').values(rows).execute();
}
