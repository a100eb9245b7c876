/**
 * `npm run dev`: ensure the local MariaDB, migrate and seed, then run the API
 * server with reload (tsx watch), the Vite dev server (which proxies /api to
 * the API server) and the local fake OAuth provider and mail server.
 */
import { prepareDatabase } from '../../server/db/prepare';
import { runOrExit, supervise } from './run';

runOrExit('bash', ['tools/dev/db.sh', 'start'], 'Starting MariaDB');
try {
  await prepareDatabase();
} catch (err) {
  console.error(`Preparing the database failed: ${(err as Error).message}`);
  process.exit(1);
}

const env = { ...process.env, NODE_ENV: 'development' };
supervise([
  { name: 'API server', command: 'npx', args: ['tsx', 'watch', '--clear-screen=false', 'server/index.ts'], options: { env } },
  { name: 'Vite dev server', command: 'npx', args: ['vite', '--host', '127.0.0.1'], options: { env } },
]);
