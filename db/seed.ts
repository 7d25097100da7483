// Seeds the demo scenario, idempotently: run it twice and nothing doubles.
import { createDb, databaseUrlFromEnv } from './connect';
import { seedDemoFleet } from './seeds/01-demo-fleet';
import { seedHistory } from './seeds/02-history';

const db = createDb(databaseUrlFromEnv(), 2);
try {
  const { fleet, people } = await seedDemoFleet(db);
  const history = await seedHistory(db, { fleetSlug: fleet.slug });
  const told = history.skipped
    ? `history already there (${history.inspections} inspections)`
    : `${history.inspections} inspections, ${history.steps} steps, ${history.defects} defects, ${history.acknowledgements} acknowledgements`;
  console.log(`[rigcall] seeded ${fleet.name}: ${people.length} people; ${told}`);
} catch (err) {
  console.error('[rigcall] seeding failed:', err);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
