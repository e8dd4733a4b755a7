// @ts-check
/**
 * ESLint 9 flat config: JavaScript's and typescript-eslint's recommended sets, the rules of hooks,
 * and the style guide's import boundaries as rules. DEVELOPERS.md ("Lint and format") lists each
 * rule and why. Formatting is Prettier's job (.prettierrc), not ESLint's.
 */
import fs from 'node:fs';
import { builtinModules } from 'node:module';
import { fileURLToPath } from 'node:url';
import js from '@eslint/js';
import { createNodeResolver, importX } from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';
import { noFolderCycle } from './scripts/lint-folder-cycles.js';

// Sessions are lucia's job, behind one module (server/modules/auth/session.ts), so that swapping
// the deprecated package touches one file.
const SESSION_MODULE = 'server/modules/auth/session.ts';
const luciaOnlyInSessionModule = {
  paths: [{ name: 'lucia', message: `Only ${SESSION_MODULE} imports lucia; use its SessionStore.` }],
  patterns: [{ group: ['@lucia-auth/*'], message: `Only ${SESSION_MODULE} imports lucia's adapters.` }],
};

// The engine is pure TypeScript that runs in the browser, the server and worker threads alike.
const engineForbidden = {
  paths: [
    ...luciaOnlyInSessionModule.paths,
    ...builtinModules.filter((name) => !name.startsWith('_')).map((name) => ({
      name,
      message: 'shared/engine imports no Node module (it also runs in the browser).',
    })),
  ],
  patterns: [
    ...luciaOnlyInSessionModule.patterns,
    { group: ['node:*'], message: 'shared/engine imports no Node module (it also runs in the browser).' },
    { group: ['react', 'react-dom', 'react-dom/*', 'react/*', '@tanstack/*'], message: 'shared/engine imports no React.' },
    { group: ['express', 'express-*', 'helmet', 'multer', 'pino', 'pino-http'], message: 'shared/engine imports no Express or server packages.' },
    { group: ['drizzle-orm', 'drizzle-orm/*', 'drizzle-kit', 'mysql2', 'mysql2/*'], message: 'shared/engine imports no Drizzle or database driver.' },
  ],
};

// DOM globals the engine must not touch (tsconfig's lib has DOM for the client, so tsc allows them).
const domGlobals = [
  'window', 'document', 'navigator', 'location', 'localStorage', 'sessionStorage', 'fetch',
  'XMLHttpRequest', 'HTMLElement', 'Element', 'Node', 'Event', 'CustomEvent', 'requestAnimationFrame',
].map((name) => ({ name, message: 'shared/engine uses no DOM: it also runs in Node worker threads.' }));

// Client features never import each other: one zone per feature folder, read from disk so a new
// feature is covered without editing this file.
const features = fs.readdirSync(new URL('./src/features', import.meta.url), { withFileTypes: true }).filter((e) => e.isDirectory()).map((e) => e.name);
const featureZones = features.map((name) => ({
  target: `./src/features/${name}`,
  from: './src/features',
  except: [`./${name}`],
  message: 'Features never import each other: move what both need to src/components, src/lib, src/hooks or shared/.',
}));

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'drizzle/**', 'tests/artifacts/**', 'bench/out/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,js,mjs}'],
    languageOptions: { globals: { ...globals.node } },
    plugins: { 'import-x': importX, 'react-hooks': reactHooks, tidefield: { rules: { 'no-folder-cycle': noFolderCycle } } },
    settings: {
      'import-x/resolver-next': [createNodeResolver({ extensions: ['.ts', '.tsx', '.js', '.mjs'] })],
      'tidefield/root': fileURLToPath(new URL('.', import.meta.url)),
    },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // The rules of hooks (hooks at the top level, complete effect dependencies). The React Compiler
      // rules of eslint-plugin-react-hooks 7's recommended set are left off: the project does not use
      // the compiler, and they would flag ordinary, correct code.
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',

      // Cycles are an error, between files and between folders.
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'tidefield/no-folder-cycle': 'error',
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            { target: './shared', from: './src', message: 'shared/ never imports the client (src/).' },
            { target: './shared', from: './server', message: 'shared/ never imports the server (server/).' },
            ...featureZones,
          ],
        },
      ],
      'no-restricted-imports': ['error', luciaOnlyInSessionModule],

      // Unused names are errors, except the conventional `_` prefix for deliberately unused
      // parameters and destructured rest siblings (`const { a, ...rest } = x`).
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
      // `@ts-ignore` with a reason is allowed: jstat (the tests' reference library) ships no types,
      // and an ignore keeps working if it ever does, where `@ts-expect-error` would then fail.
      '@typescript-eslint/ban-ts-comment': ['error', { 'ts-ignore': 'allow-with-description' }],
    },
  },
  {
    // Tests build deliberately malformed documents and poke at library internals; `any` there is
    // the honest type.
    files: ['**/*.test.{ts,tsx}', 'tests/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
  },
  {
    // The engine's runtime code; its tests run in Node and may read fixtures with node:fs.
    files: ['shared/engine/**/*.ts'],
    ignores: ['**/*.test.ts'],
    rules: {
      // Published coefficients are written with every digit the source prints (e.g. the rational
      // approximations in numerics/); a double rounds them, which is intended, not a bug.
      'no-loss-of-precision': 'off',
      'no-restricted-imports': ['error', engineForbidden],
      'no-restricted-globals': ['error', ...domGlobals],
    },
  },
  {
    files: [SESSION_MODULE],
    rules: { 'no-restricted-imports': 'off' },
  },
);
