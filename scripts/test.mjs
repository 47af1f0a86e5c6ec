#!/usr/bin/env node
// `npm test`: everything CI runs. Each check (type check, lint, OpenAPI drift) counts as one test;
// vitest's own tests are counted one by one. Ends with the line `N passed, N failed`.
import { spawnSync } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';

const steps = [
  ['type check', 'npx', ['tsc', '--noEmit', '-p', '.']],
  ['lint', 'npx', ['eslint', '--max-warnings=0', '.']],
  ['openapi document is up to date', 'npm', ['run', '-s', 'openapi:check']],
];

let passed = 0;
let failed = 0;
for (const [name, cmd, args] of steps) {
  process.stdout.write(`\n== ${name}\n`);
  const r = spawnSync(cmd, args, { stdio: 'inherit' });
  if (r.status === 0) { passed++; console.log(`ok: ${name}`); } else { failed++; console.log(`FAILED: ${name}`); }
}

const report = '.test-results.json';
rmSync(report, { force: true });
process.stdout.write('\n== vitest\n');
const v = spawnSync('npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...process.argv.slice(2)], { stdio: 'inherit' });
let skipped = 0;
try {
  const json = JSON.parse(readFileSync(report, 'utf8'));
  passed += json.numPassedTests;
  failed += json.numFailedTests;
  skipped += json.numPendingTests + json.numTodoTests;
  // A suite that fails to load counts as a failure even when it holds no test.
  failed += json.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
} catch {
  failed++;
  console.log('FAILED: vitest produced no report');
}
if (v.status !== 0 && failed === 0) failed++;
console.log('');
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failed === 0 ? 0 : 1);
