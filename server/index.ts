/**
 * Server entry: connects to MariaDB, builds the app and listens on loopback.
 * In production mode (NODE_ENV=production) it also serves the built client.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadConfig } from './config/index';
import { createSequelize } from './db/sequelize';
import { initModels } from './models/index';
import { createApp } from './app';

const config = loadConfig();
const sequelize = createSequelize(config.db);
initModels(sequelize);

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const app = createApp({
  config,
  sequelize,
  clientDir: config.env === 'production' ? path.join(root, 'dist') : undefined,
});

const server = app.listen(config.port, config.host, (err?: Error) => {
  if (err) return reportListenError(err);
  console.log(`Dwellform is running at http://${config.host}:${config.port}`);
});
server.on('error', reportListenError);

function reportListenError(err: NodeJS.ErrnoException) {
  if (err.code === 'EADDRINUSE') {
    console.error(`Port ${config.port} on ${config.host} is already in use; stop the other process or set PORT to a free port.`);
  } else {
    console.error(`Could not listen on ${config.host}:${config.port}: ${err.message}`);
  }
  process.exit(1);
}

async function shutdown() {
  // Stop taking requests and drop idle keep-alive sockets before the pool closes.
  await new Promise<void>((done) => {
    server.close(() => done());
    server.closeIdleConnections();
    setTimeout(done, 2_000).unref();
  });
  await sequelize.close().catch(() => {});
  process.exit(0);
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
