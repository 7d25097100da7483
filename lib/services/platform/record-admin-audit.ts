import 'server-only';
import type { DB } from '@/lib/db';
import { recordAudit } from './record-audit';

export type AdminAuditEntry = {
  fleetId: string;
  actorId: string;
  action: string;
  entity: 'app_user' | 'unit' | 'fleet';
  entityId: string;
  detail: Record<string, unknown>;
};

/** Append one row to the audit log, inside the caller's transaction. */
export async function recordAdminAudit(db: DB, e: AdminAuditEntry): Promise<void> {
  await recordAudit(db, e);
}

/** The fields that differ between before and after, as { field: { from, to } }. */
export function diffFields<T extends Record<string, unknown>>(
  before: T,
  after: Partial<T>,
): Record<string, { from: unknown; to: unknown }> {
  const changes: Record<string, { from: unknown; to: unknown }> = {};
  for (const [key, to] of Object.entries(after)) {
    if (to === undefined) continue;
    const from = before[key];
    if (JSON.stringify(from) !== JSON.stringify(to)) changes[key] = { from, to };
  }
  return changes;
}

/** True for a PostgreSQL unique violation (optionally on one named index). */
export function isUniqueViolation(err: unknown, constraint?: string): boolean {
  const e = err as { code?: string; constraint?: string } | null;
  return e?.code === '23505' && (!constraint || e.constraint === constraint);
}
