// GET / : the scenario page, static files from public/ (same-origin scripts, styles and plots only,
// so that a strict Content-Security-Policy holds). Each file gets its own route (no wildcard), so
// unknown paths still answer the service's 404 problem.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fastifyStatic from '@fastify/static';
import fp from 'fastify-plugin';
import type { FastifyInstance } from 'fastify';

/** public/ beside src/ (running from source) or beside dist/ (running the build). */
export function publicRoot(): string {
  for (const rel of ['../../public/', '../../../public/']) {
    const dir = fileURLToPath(new URL(rel, import.meta.url));
    if (existsSync(`${dir}index.html`)) return dir;
  }
  throw new Error('the scenario page (public/index.html) is missing');
}

export default fp(async function page(app: FastifyInstance) {
  await app.register(fastifyStatic, { root: publicRoot(), prefix: '/', wildcard: false, index: ['index.html'], cacheControl: true, maxAge: 60_000 });
  // Browsers ask for it by themselves; no icon, and no 404 in their consoles.
  app.get('/favicon.ico', { schema: { hide: true } }, async (_request, reply) => reply.code(204).header('cache-control', 'public, max-age=86400').send());
}, { name: 'page' });
