// Rewrites the table at the end of docs/errors.md from src/errors.ts (`npm run docs:errors`).
import { readFileSync, writeFileSync } from 'node:fs';
import { ERRORS } from '../src/errors.js';

const path = 'docs/errors.md';
const header = '| code | status | title | meaning |\n|---|---|---|---|\n';
const text = readFileSync(path, 'utf8');
const intro = text.slice(0, text.indexOf(header));
const rows = Object.entries(ERRORS).map(([code, e]) => `| \`${code}\` | ${e.status} | ${e.title} | ${e.meaning.replaceAll('|', '\\|')} |`);
writeFileSync(path, intro + header + rows.join('\n') + '\n');
console.log(`wrote ${path} (${rows.length} codes)`);
