import 'server-only';
import type { DB } from './index';

export async function findFleet(db: DB, { fleetId }: { fleetId: string }) {
  return db
    .selectFrom('fleet')
    .select(['id', 'name', 'timezone', 'ruleProfile', 'minPretripMinutes', 'minPosttripMinutes', 'tirePressureTargets'])
    .where('id', '=', fleetId)
    .executeTakeFirst();
}
