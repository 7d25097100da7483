import 'server-only';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { recordAudit } from '../platform/record-audit';

/**
 * A change to a signed report: the attempt is logged (on its own connection, outside the refused
 * write, so that it stays on record) and the error to throw is returned with the words the
 * driver sees.
 */
export async function refuseLockedChange(
  { fleetId, actorId, inspectionId }: { fleetId: string; actorId: string; inspectionId: string },
  detail: Record<string, unknown>,
  message: string,
): Promise<AppError> {
  await recordAudit(getDb(), {
    fleetId,
    actorId,
    action: 'inspection.change_refused',
    entity: 'inspection',
    entityId: inspectionId,
    detail,
  });
  return new AppError('conflict', message);
}
