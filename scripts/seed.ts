/** `npm run seed`: (re)applies the demo seed to the local database. Idempotent. */
import { connectDatabase, migrateDatabase } from '../server/db/client.ts';
import { isLocalDemo, loadConfig } from '../server/config.ts';
import { DEMO_DEPARTMENT, seedDemo } from '../server/seed/demo.ts';
import { ensurePublishedLibrary } from '../server/modules/samples/samples.service.ts';
import { ensureDevDatabase } from './mariadb.ts';

const { env: dbEnv } = await ensureDevDatabase();
const config = loadConfig({ ...process.env, ...dbEnv });
if (!isLocalDemo(config)) {
  console.error('The demo department (with its published password) is seeded only in the local demo mode: the app, payments and e-mail on this machine. Nothing was seeded.');
  process.exit(1);
}
const database = connectDatabase(config);
try {
  await migrateDatabase(database);
  await ensurePublishedLibrary(database.db);
  const result = await seedDemo(database.db, config.DEMO_PASSWORD);
  console.log(result.created ? `Seeded the demo department "${DEMO_DEPARTMENT}".` : `The demo department "${DEMO_DEPARTMENT}" was already there; missing demo rows were added.`);
} finally {
  await database.close();
}
