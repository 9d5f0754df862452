import next from 'eslint-config-next';
import nextTypescript from 'eslint-config-next/typescript';

// The pure core must stay free of the framework, the database and Node I/O, so the browser can run it
// and its output stays deterministic.
const PURE_CORE = ['lib/shape', 'lib/space', 'lib/boundary', 'lib/edition', 'lib/render', 'lib/pack', 'lib/stats', 'lib/study', 'lib/sequence', 'lib/results', 'lib/plot'];
const FORBIDDEN_IN_CORE = [
  { group: ['next', 'next/*', 'react', 'react/*', 'react-dom', 'react-dom/*'], message: 'The pure core never imports Next or React.' },
  { group: ['zod', 'zod/*'], message: 'Validation belongs in lib/schemas; the core takes typed values.' },
  { group: ['@/db/*', '**/db/*', 'pg', 'kysely', 'pg-boss'], message: 'The pure core never touches the database.' },
  { group: ['@/lib/server/*', 'server-only'], message: 'The pure core never imports server code.' },
  {
    group: ['fs', 'fs/*', 'node:fs', 'node:fs/*', 'path', 'node:path', 'child_process', 'node:child_process', 'net', 'node:net', 'http', 'node:http', 'https', 'node:https', 'os', 'node:os', 'worker_threads', 'node:worker_threads'],
    message: 'The pure core does no I/O.',
  },
];

const config = [
  { ignores: ['.next/**', 'node_modules/**', 'test-results/**', 'playwright-report/**', 'next-env.d.ts', '.data/**'] },
  ...next,
  ...nextTypescript,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      // The React Compiler is not enabled, so its memoisation warnings about libraries do not apply.
      'react-hooks/incompatible-library': 'off',
    },
  },
  {
    files: PURE_CORE.map((dir) => `${dir}/**/*.ts`),
    rules: { 'no-restricted-imports': ['error', { patterns: FORBIDDEN_IN_CORE }] },
  },
  {
    files: ['migrations/**/*.ts'],
    rules: {
      '@typescript-eslint/no-explicit-any': 'off',
      'no-restricted-imports': ['error', { patterns: [{ group: ['@/*', '../*'], message: 'Migrations never import app code.' }] }],
    },
  },
  {
    files: ['scripts/**/*.{mjs,ts}', 'tests/**/*.ts', '*.config.{ts,mjs}'],
    rules: { 'import/no-anonymous-default-export': 'off' },
  },
];

export default config;
