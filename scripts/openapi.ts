// Generates the OpenAPI document from the route schemas, and the typed client's types from it.
//   --check  exits 1 when either committed file differs from the generated one
import { readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import openapiTS, { astToString } from 'openapi-typescript';
import { buildApp } from '../src/app.js';

export const OPENAPI_PATH = 'openapi/openapi.json';
export const CLIENT_TYPES_PATH = 'src/client/schema.ts';

export async function generateOpenApi(): Promise<string> {
  const app = await buildApp({ logger: false });
  await app.ready();
  const text = JSON.stringify(app.swagger(), null, 2) + '\n';
  await app.close();
  return text;
}

/** TypeScript types of every path, operation and component of the document (openapi-typescript). */
export async function generateClientTypes(document: string): Promise<string> {
  const ast = await openapiTS(JSON.parse(document), { alphabetize: true, defaultNonNullable: false });
  return '// Generated from openapi/openapi.json by `npm run openapi` (openapi-typescript). Do not edit.\n' +
    astToString(ast);
}

const mode = process.argv[2];
if (mode === '--write' || mode === '--check') {
  const document = await generateOpenApi();
  const files: [string, string][] = [[OPENAPI_PATH, document], [CLIENT_TYPES_PATH, await generateClientTypes(document)]];
  let stale = false;
  for (const [path, generated] of files) {
    if (mode === '--write') {
      mkdirSync(path.slice(0, path.lastIndexOf('/')), { recursive: true });
      writeFileSync(path, generated);
      console.log(`wrote ${path} (${generated.length} bytes)`);
      continue;
    }
    let committed = '';
    try { committed = readFileSync(path, 'utf8'); } catch { /* missing counts as stale */ }
    if (committed !== generated) {
      console.error(`${path} is stale: run \`npm run openapi\` and commit the result`);
      stale = true;
    } else console.log(`${path} is up to date`);
  }
  if (stale) process.exit(1);
}
