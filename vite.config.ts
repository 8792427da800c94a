/// <reference types="vitest/config" />
import { defineConfig, type Plugin } from 'vite';
import vue from '@vitejs/plugin-vue';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';
import { fileURLToPath } from 'node:url';
import { unitFactorsModule } from './shared/unit-factors.js';

const unitFactorsFile = fileURLToPath(new URL('./shared/unit-factors.ts', import.meta.url));

/** The client gets the unit factors mathjs gives as plain numbers, so no page downloads mathjs for six constants. */
const unitFactorsAsNumbers: Plugin = {
  name: 'loadline-unit-factors',
  apply: 'build',
  enforce: 'pre',
  load: (id) => (id.split('?')[0] === unitFactorsFile ? unitFactorsModule() : null),
};

const apiPort = process.env.PORT ?? '8080';
// The API tests' own database (see server/test/test-env.ts); never the demo's.
const testDatabaseUrl = process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54339/loadline_test';

export default defineConfig({
  root: 'client',
  plugins: [
    vue(),
    unitFactorsAsNumbers,
    // Scripts, styles and fonts are compressed once at build time; the server sends the smallest the browser accepts.
    compression({
      include: /\.(js|css|svg|json|ttf|eot|html)$/,
      exclude: /index\.html$/,
      // Every script, however small: a page loads a dozen chunks under 1 kB, each smaller compressed.
      threshold: 0,
      algorithms: [defineAlgorithm('brotliCompress'), defineAlgorithm('gzip', { level: 9 })],
      deleteOriginalAssets: false,
    }),
  ],
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
          include: ['shared/**/*.spec.ts', 'client/src/**/*.spec.ts', 'server/**/*.unit.spec.ts', 'seeds/**/*.unit.spec.ts', 'standins/**/*.spec.ts'],
          environment: 'node',
          // Property tests run thousands of cases; a 2-core machine under load needs more than the 5 s default.
          testTimeout: 30000,
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
