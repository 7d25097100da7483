// The zones and items of one inspection, from its kind, its vehicle configuration and the zone
// checklists of its vocabulary version. The one place this is worked out: the walk screen, the
// server's step checks, the report and the office board all call it.
import type { MeasureKind, VehicleConfiguration, ZoneItem, Zones } from '@/lib/schemas/grammar';

export type InspectionKind = 'pre_trip' | 'post_trip';
export type WalkZone = { id: string; name: string; items: ZoneItem[] };

export const configurationOf = (hasTrailer: boolean): VehicleConfiguration =>
  hasTrailer ? 'tractor_trailer' : 'bobtail';

/** Zones that belong to the pre-trip only: the air-brake tests are done before the day's driving. */
const preTripOnlyZones = new Set(['air_brake_tests']);

/** The walk for one inspection: its zones in walk order, each with the items that apply. */
export function listWalkZones(
  zones: Zones,
  { kind, configuration }: { kind: InspectionKind; configuration: VehicleConfiguration },
): WalkZone[] {
  return zones.zones
    .filter((z) => z.configurations.includes(configuration))
    .filter((z) => kind === 'pre_trip' || !preTripOnlyZones.has(z.id))
    .map((z) => ({ id: z.id, name: z.name, items: z.items.filter((i) => i.configurations.includes(configuration)) }))
    .filter((z) => z.items.length > 0);
}

/** A zone's name in the inspection's grammar; the id in words when the zone is unknown. */
export function zoneName(zones: Zones, id: string): string {
  return zones.zones.find((z) => z.id === id)?.name ?? id.replace(/_/g, ' ');
}

export const isReadingItem = (item: Pick<ZoneItem, 'measure'>): boolean => !!item.measure;

/**
 * Readings a pre-trip must carry (a number, or "not checked" with a reason) unless the fleet
 * chooses otherwise: the air-brake tests. Tread depth, tire pressure, pushrod stroke and the
 * other gauge readings are optional by default.
 */
export const DEFAULT_REQUIRED_READINGS: readonly MeasureKind[] = [
  'air_buildup',
  'governor_cutout',
  'governor_cutin',
  'air_leak',
  'low_air_warning',
];

/** Whether this item must be answered before the report can be signed. */
export function isRequiredItem(
  item: Pick<ZoneItem, 'measure'>,
  { kind, requiredReadings }: { kind: InspectionKind; requiredReadings: readonly MeasureKind[] },
): boolean {
  if (!item.measure) return true;
  return kind === 'pre_trip' && requiredReadings.includes(item.measure);
}
