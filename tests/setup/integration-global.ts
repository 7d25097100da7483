// Integration tests run against a real PostgreSQL: the test database that `npm test` creates
// (through scripts/stack.mjs). Here we refuse anything that is not on loopback, and migrate.
import { createDb } from '../../db/connect';
import { migrateToLatest } from '../../db/migrate';

export default async function setup() {
  const url = process.env.DATABASE_URL;
  if (!url)
    throw new Error('DATABASE_URL is not set: run integration tests with `npm run test:integration` or `npm test`.');
  const host = new URL(url).hostname;
  if (!['127.0.0.1', 'localhost', '::1'].includes(host))
    throw new Error(`refusing to run tests against a database on ${host}`);
  if (!new URL(url).pathname.endsWith('_test'))
    throw new Error('integration tests only run on a database whose name ends in _test');
  const db = createDb(url, 1);
  await migrateToLatest(db);
  await db.destroy();
}
