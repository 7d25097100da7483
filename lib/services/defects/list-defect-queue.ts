import 'server-only';
import { getDb } from '@/lib/db';
import { listDefectRows } from '@/lib/db/defects';
import type { DefectQueueGroup, ListDefectsQuery } from '@/lib/schemas/defects';

/** The mechanic's queue: defects grouped by unit, out-of-service units first, major before minor. */
export async function listDefectQueue({ fleetId, query }: { fleetId: string; query: ListDefectsQuery }) {
  const rows = await listDefectRows(getDb(), { fleetId, ...query });
  const groups = new Map<string, DefectQueueGroup>();
  for (const r of rows) {
    const g = groups.get(r.unitId) ?? {
      unitId: r.unitId,
      unitNumber: r.unitNumber,
      unitKind: r.unitKind,
      unitStatus: r.unitStatus,
      major: [],
      minor: [],
    };
    g[r.severity].push(r);
    groups.set(r.unitId, g);
  }
  return { rows, groups: [...groups.values()] };
}
