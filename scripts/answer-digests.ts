// Rewrites test/fixtures/answer-digests.json, the byte-identity guard's table
// (`npm run -s answers:digests`). Run it only for an intended change of answers, which comes with a
// SOLVER_VERSION bump (src/solver/core/version.ts) and a reason in the commit message.
import { writeFileSync } from 'node:fs';
import { SOLVER_VERSION } from '../src/solver/core/version.js';
import { answerDigests } from '../test/helpers/answer-digests.js';
import { testApp } from '../test/helpers/app.js';

export const DIGESTS_PATH = 'test/fixtures/answer-digests.json';

const app = await testApp();
const { digests: answers } = await answerDigests(app);
await app.close();
const table = {
  note: 'SHA-256 of answer bytes; written by `npm run -s answers:digests`. A change must come with a SOLVER_VERSION bump and a reason (test/http/answer-bytes.test.ts).',
  solverVersion: SOLVER_VERSION,
  answers,
};
writeFileSync(DIGESTS_PATH, JSON.stringify(table, null, 2) + '\n');
console.log(`wrote ${DIGESTS_PATH} (${Object.keys(answers).length} answers, solver ${SOLVER_VERSION})`);
