import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { testApp } from '../helpers/app.js';

// The README's curl examples must keep working: each is sent to the app as written.
describe('README examples', () => {
  it('every curl example in README.md answers 200', async () => {
    const app = await testApp();
    const text = readFileSync('README.md', 'utf8');
    const examples = [...text.matchAll(/curl -s http:\/\/127\.0\.0\.1:8080(\S+) -H 'content-type: application\/json'(?: -H '([^']+)')? -d '([\s\S]*?)'/g)];
    expect(examples.length).toBeGreaterThanOrEqual(6);
    for (const [, url, header, body] of examples) {
      const headers: Record<string, string> = { 'content-type': 'application/json' };
      if (header) {
        const [name, value] = header.split(': ');
        headers[name!] = value!;
      }
      const res = await app.inject({ method: 'POST', url: url!, payload: body!, headers });
      expect(res.statusCode, `${url}: ${res.body.slice(0, 300)}`).toBe(200);
    }
    await app.close();
  });
});
