/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import { fileURLToPath } from 'node:url';

const apiPort = process.env.PORT ?? '8080';
// The API tests' own database (see server/test/test-env.ts); never the demo's.
const testDatabaseUrl = process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54339/loadline_test';

export default defineConfig({
  root: 'client',
  plugins: [vue()],
  resolve: { alias: { '@shared': fileURLToPath(new URL('./shared', import.meta.url)) } },
  build: { outDir: '../dist/client', emptyOutDir: true, chunkSizeWarningLimit: 800 },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}`, '/files': `http://127.0.0.1:${apiPort}` },
  },
  test: {
    root: '.',
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['shared/**/*.spec.ts', 'client/src/**/*.spec.ts', 'server/**/*.unit.spec.ts', 'standins/**/*.spec.ts'],
          environment: 'node',
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['server/**/*.api.spec.ts', 'seeds/**/*.api.spec.ts'],
          environment: 'node',
          globalSetup: ['server/test/global-setup.ts'],
          setupFiles: ['server/test/setup-api.ts'],
          env: {
            NODE_ENV: 'test',
            LOG_LEVEL: 'silent',
            DATABASE_URL: testDatabaseUrl,
            JWT_SECRET: 'test-secret-test-secret-test-secret-0123',
            // Mail retries a second apart, so a test can watch a retry happen.
            MAIL_RETRY_LIMIT: '5',
            MAIL_RETRY_DELAY_SECONDS: '1',
          },
          fileParallelism: false,
          testTimeout: 20000,
          hookTimeout: 60000,
        },
      },
    ],
  },
});
