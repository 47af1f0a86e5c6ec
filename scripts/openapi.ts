// Generates the OpenAPI document from the route schemas.
//   --write  writes openapi/openapi.json
//   --check  exits 1 when the committed file differs from the generated one
import { readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { buildApp } from '../src/app.js';

export const OPENAPI_PATH = 'openapi/openapi.json';

export async function generateOpenApi(): Promise<string> {
  const app = await buildApp({ logger: false });
  await app.ready();
  const text = JSON.stringify(app.swagger(), null, 2) + '\n';
  await app.close();
  return text;
}

const mode = process.argv[2];
if (mode === '--write' || mode === '--check') {
  const generated = await generateOpenApi();
  if (mode === '--write') {
    mkdirSync('openapi', { recursive: true });
    writeFileSync(OPENAPI_PATH, generated);
    console.log(`wrote ${OPENAPI_PATH} (${generated.length} bytes)`);
  } else {
    let committed = '';
    try { committed = readFileSync(OPENAPI_PATH, 'utf8'); } catch { /* missing counts as stale */ }
    if (committed !== generated) {
      console.error(`${OPENAPI_PATH} is stale: run \`npm run openapi\` and commit the result`);
      process.exit(1);
    }
    console.log(`${OPENAPI_PATH} is up to date`);
  }
}
