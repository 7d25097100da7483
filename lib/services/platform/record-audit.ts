import 'server-only';
import type { DB } from '@/lib/db';

/** One line in the append-only audit log. */
export async function recordAudit(
  db: DB,
  entry: {
    fleetId: string;
    actorId: string | null;
    action: string;
    entity: string;
    entityId: string;
    detail?: Record<string, unknown>;
  },
): Promise<void> {
  await db
    .insertInto('auditLog')
    .values({
      fleetId: entry.fleetId,
      actorId: entry.actorId,
      action: entry.action,
      entity: entry.entity,
      entityId: entry.entityId,
      detail: JSON.stringify(entry.detail ?? {}),
    })
    .execute();
}
