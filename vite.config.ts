/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// One config for the client build, the dev server and the test runner.
// The API port the dev proxy forwards to follows PORT (default 3000), like the server.
const apiPort = Number(process.env.PORT ?? 3000);

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: { outDir: 'dist/client', emptyOutDir: true, chunkSizeWarningLimit: 1500 },
  server: {
    port: 5173,
    // '/api/' (with the slash) so client routes such as /api-tokens are not sent to the API.
    proxy: { '/api/': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  optimizeDeps: { exclude: ['@node-rs/argon2'] },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          // Projects run one after another: fast unit suites, then API, then browser.
          sequence: { groupOrder: 0 },
          include: [
            'shared/**/*.test.ts',
            'src/**/*.test.{ts,tsx}',
            'scripts/**/*.test.ts',
            'server/engine-pool/**/*.test.ts',
            'server/cli/**/*.test.ts',
          ],
          environment: 'node',
          // On two shared cores a test that takes 1 s alone can take 10 s; the heaviest suites
          // (kernel, direct integration, engine pool) also carry their own explicit timeouts.
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          sequence: { groupOrder: 1 },
          include: ['server/**/*.test.ts', 'tests/api/**/*.test.ts'],
          exclude: ['server/engine-pool/**', 'server/cli/**', '**/node_modules/**'],
          environment: 'node',
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          // Test files share one MariaDB server but each gets its own database.
          fileParallelism: true,
          maxWorkers: 2,
        },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          sequence: { groupOrder: 2 },
          include: ['tests/browser/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/global-setup.ts', 'tests/support/browser-global-setup.ts'],
          testTimeout: 120_000,
          hookTimeout: 240_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
