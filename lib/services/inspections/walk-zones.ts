import 'server-only';
import zonesGrammar from '@/grammars/zones.json' with { type: 'json' };

type GrammarZone = { id: string; name: string; configurations: string[] };
const zones = (zonesGrammar as unknown as { zones: GrammarZone[] }).zones;

/** The zones a walk of this configuration is expected to visit, in walk order. */
export function listExpectedZones(hasTrailer: boolean): { id: string; name: string }[] {
  const config = hasTrailer ? 'tractor_trailer' : 'bobtail';
  return zones.filter((z) => z.configurations.includes(config)).map((z) => ({ id: z.id, name: z.name }));
}

export function zoneName(id: string): string {
  return zones.find((z) => z.id === id)?.name ?? id.replace(/_/g, ' ');
}
