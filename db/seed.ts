// Seeds the demo scenario, idempotently: run it twice and nothing doubles.
import { createDb, databaseUrlFromEnv } from './connect';
import { seedDemoFleet } from './seeds/01-demo-fleet';

const db = createDb(databaseUrlFromEnv(), 2);
try {
  const { fleet, people } = await seedDemoFleet(db);
  console.log(`[rigcall] seeded ${fleet.name}: ${people.length} people`);
} catch (err) {
  console.error('[rigcall] seeding failed:', err);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
