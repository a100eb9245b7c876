/**
 * `npm start`: ensure the local MariaDB, migrate, seed the demo once, build the
 * client (skip with --no-build or SKIP_BUILD=1), start the local fake OAuth
 * provider and fake mail server (demo mode), then serve the built app in
 * production mode on http://127.0.0.1:PORT.
 */
import { loadConfig } from '../../server/config/index';
import { prepareDatabase } from '../../server/db/prepare';
import { runOrExit, supervise } from './run';
import { startFakes } from './fakes';

const config = loadConfig({ ...process.env, NODE_ENV: 'production' });
const skipBuild = process.argv.includes('--no-build') || process.env.SKIP_BUILD === '1';

runOrExit('bash', ['tools/dev/db.sh', 'start'], 'Starting MariaDB');
try {
  await prepareDatabase(config);
} catch (err) {
  console.error(`Preparing the database failed: ${(err as Error).message}`);
  process.exit(1);
}
if (!skipBuild) runOrExit('npx', ['vite', 'build', '--logLevel', 'warn'], 'Building the client');

try {
  await startFakes({ ...process.env, NODE_ENV: 'production' });
} catch (err) {
  console.error(`Starting the local fake OAuth/mail servers failed: ${(err as Error).message}`);
  process.exit(1);
}

supervise([
  { name: 'server', command: 'npx', args: ['tsx', 'server/index.ts'], options: { env: { ...process.env, NODE_ENV: 'production' } } },
]);
