/**
 * `npm run dev`: the API (with the private MariaDB) plus Vite's dev server, which proxies
 * /api to it. Open the address Vite prints (http://127.0.0.1:5173).
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { loadConfig, publicBaseUrl } from '../server/config.ts';
import { startLocalFakes } from '../server/fakes/local-fakes.ts';
import { startServer } from '../server/index.ts';
import { countDepartments } from '../server/modules/departments/departments.repository.ts';
import { seedDemo } from '../server/seed/demo.ts';
import { PROJECT_ROOT, ensureDevDatabase } from './mariadb.ts';

const { env: dbEnv } = await ensureDevDatabase();
const config = loadConfig({
  NODE_ENV: 'development',
  ...process.env,
  CLIENT_DIST: '.data/no-client-in-dev',
  ...dbEnv,
});
const fakes = await startLocalFakes(config, `${publicBaseUrl(config)}/api/billing/webhook`);
const running = await startServer(config);
if ((await countDepartments(running.database.db)) === 0) await seedDemo(running.database.db, config.DEMO_PASSWORD);
console.log(`API at ${running.url}; starting Vite …`);

const vite = spawn(process.execPath, [path.join(PROJECT_ROOT, 'node_modules/vite/bin/vite.js'), '--host', '127.0.0.1'], {
  cwd: PROJECT_ROOT,
  stdio: 'inherit',
  env: { ...process.env, PORT: String(config.PORT) },
});
const stop = async () => {
  vite.kill('SIGTERM');
  await running.stop();
  await fakes.close();
  process.exit(0);
};
process.once('SIGINT', () => void stop());
process.once('SIGTERM', () => void stop());
