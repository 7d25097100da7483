import type { VehicleConfiguration, ZoneItem, Zones } from '@/lib/schemas/grammar';

export type WalkZone = { id: string; name: string; items: ZoneItem[] };

/** The walk for one vehicle configuration: its zones in order, each with the items that apply. */
export function listWalkZones(zones: Zones, configuration: VehicleConfiguration): WalkZone[] {
  return zones.zones
    .filter((z) => z.configurations.includes(configuration))
    .map((z) => ({ id: z.id, name: z.name, items: z.items.filter((i) => i.configurations.includes(configuration)) }))
    .filter((z) => z.items.length > 0);
}
