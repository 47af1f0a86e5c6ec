// Loads odex (CommonJS, ships its .ts sources) for src/solver/numerics/ode.ts.
// A static `import 'odex'` (or 'odex/src/odex.js') makes tsc resolve the package's own odex.ts,
// which fails this project's strict checks; createRequire keeps tsc out of the package and works
// the same under node, tsx and vitest. It lives outside src/solver because the solver does not
// import node:* (lint rule).
import { createRequire } from 'node:module';
import type { OdexModule } from '../types/odex.js';

const load = createRequire(import.meta.url);

export const odex = load('odex') as OdexModule;
