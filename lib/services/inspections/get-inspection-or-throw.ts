import 'server-only';
import { getDb } from '@/lib/db';
import { findInspectionDetail } from '@/lib/db/inspections';
import { AppError } from '@/lib/errors';

/** An inspection report of the caller's fleet; another fleet's is simply not found. */
export async function getInspectionOrThrow({ fleetId, id }: { fleetId: string; id: string }) {
  const found = await findInspectionDetail(getDb(), { fleetId, id });
  if (!found) throw new AppError('not_found', 'No such inspection report in your fleet.');
  return found;
}
