import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist/**', '.build-test/**', 'node_modules/**', 'openapi/**', 'coverage/**', 'scratch/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'no-console': 'off',
    },
  },
  {
    // The scenario page runs in the browser.
    files: ['public/**/*.js'],
    languageOptions: { globals: { ...globals.browser } },
  },
  {
    // The solver is pure math: no HTTP, schemas, caches or Node built-ins.
    files: ['src/solver/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: ['fastify*', 'zod', 'zod/*', 'node:*', '../routes/*', '../schemas/*', '../cache/*'] }],
    },
  },
);
