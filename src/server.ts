// Reads the environment, builds the app, listens; closes cleanly on SIGINT/SIGTERM, and exits
// anyway once SHUTDOWN_DEADLINE_S has passed (a stalled client or a stuck job never holds it).
import { buildApp } from './app.js';
import { loadConfig } from './config.js';

let config;
try {
  config = loadConfig();
} catch (error) {
  console.error((error as Error).message);
  process.exit(2);
}

const app = await buildApp({ config, logger: { level: config.LOG_LEVEL } });
let stopping = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (stopping) return;
    stopping = true;
    const deadlineS = config.SHUTDOWN_DEADLINE_S;
    app.log.info({ signal, deadlineS }, 'closing');
    setTimeout(() => {
      app.log.warn({ deadlineS }, 'shutdown deadline passed: exiting with work still in hand');
      process.exit(1);
    }, deadlineS * 1000);
    app.close().then(() => process.exit(0), (error: unknown) => {
      app.log.error({ err: error }, 'close failed');
      process.exit(1);
    });
  });
}
// SIGHUP: read EOP_FILE again (a bad file keeps the table in force; both are logged).
process.on('SIGHUP', () => { void app.eop.reload(); });
try {
  await app.listen({ port: config.PORT, host: config.HOST });
} catch (error) {
  app.log.fatal({ err: error }, 'could not listen');
  process.exit(1);
}
