// Reads the environment, builds the app, listens; closes cleanly on SIGINT/SIGTERM.
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
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    app.log.info({ signal }, 'closing');
    app.close().then(() => process.exit(0), () => process.exit(1));
  });
}
try {
  await app.listen({ port: config.PORT, host: config.HOST });
} catch (error) {
  app.log.fatal({ err: error }, 'could not listen');
  process.exit(1);
}
