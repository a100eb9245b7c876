/**
 * `npm run dev`: ensure the local MariaDB, migrate and seed, then run the API
 * server with reload (tsx watch), the Vite dev server (which proxies /api to
 * the API server) and the local fake OAuth provider and mail server.
 */
import { prepareDatabase } from '../../server/db/prepare';
import { runOrExit, supervise } from './run';
import { startFakes } from './fakes';

runOrExit('bash', ['tools/dev/db.sh', 'start'], 'Starting MariaDB');
try {
  await prepareDatabase();
} catch (err) {
  console.error(`Preparing the database failed: ${(err as Error).message}`);
  process.exit(1);
}

// The browser talks to Vite (which proxies /api), so OAuth must call back there.
const env = { ...process.env, NODE_ENV: 'development', PUBLIC_URL: process.env.PUBLIC_URL ?? 'http://127.0.0.1:5173' };
try {
  await startFakes(env);
} catch (err) {
  console.error(`Starting the local fake OAuth/mail servers failed: ${(err as Error).message}`);
  process.exit(1);
}
supervise([
  { name: 'API server', command: 'npx', args: ['tsx', 'watch', '--clear-screen=false', 'server/index.ts'], options: { env } },
  { name: 'Vite dev server', command: 'npx', args: ['vite', '--host', '127.0.0.1'], options: { env } },
]);
