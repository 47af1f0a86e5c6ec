import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { ERRORS, errorCodes } from '../src/errors.js';
import { SOLVER_FAILURE_CODES } from '../src/solver/core/result.js';

describe('error table', () => {
  it('docs/errors.md lists exactly the codes of src/errors.ts with the same status and title', () => {
    const rows = readFileSync('docs/errors.md', 'utf8').split('\n').filter((l) => l.startsWith('| `'));
    const documented = new Map(rows.map((row) => {
      const [code, status, title] = row.split('|').slice(1, 4).map((c) => c.trim());
      return [code!.replaceAll('`', ''), { status: Number(status), title }];
    }));
    expect([...documented.keys()].sort()).toEqual(errorCodes().sort());
    for (const code of errorCodes()) expect(documented.get(code), code).toEqual({ status: ERRORS[code].status, title: ERRORS[code].title });
  });

  it('every solver failure code has an HTTP problem, and none of them is a 5xx', () => {
    for (const code of SOLVER_FAILURE_CODES) {
      expect(ERRORS[code], code).toBeDefined();
      expect(ERRORS[code].status).toBeGreaterThanOrEqual(400);
      expect(ERRORS[code].status).toBeLessThan(500);
    }
  });
});
