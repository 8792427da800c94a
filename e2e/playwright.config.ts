import { defineConfig } from '@playwright/test';

const port = Number(process.env.E2E_PORT ?? 8090);
const databaseUrl = process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54339/loadline_e2e';
// The mail stand-in npm test starts (scripts/test.sh); the server under test sends to it and reads it back.
const mailSmtpPort = process.env.MAIL_STANDIN_SMTP_PORT ?? '2535';
const mailHttpPort = process.env.MAIL_STANDIN_HTTP_PORT ?? '2536';

export default defineConfig({
  testDir: '.',
  testMatch: '**/*.e2e.ts',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  // Long journeys on a 2-core machine that also runs the server and the stand-ins.
  timeout: 60_000,
  // Assertions wait on what the user sees; a loaded two-core machine can take several seconds to show it.
  expect: { timeout: 15_000 },
  reporter: [['list'], ['json', { outputFile: '../test-results/e2e.json' }]],
  outputDir: '../test-results/e2e-artifacts',
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/lib/chromium/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-dev-shm-usage',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
      ],
    },
  },
  webServer: {
    command: 'npx tsx --tsconfig tsconfig.server.json server/index.ts',
    cwd: '..',
    url: `http://127.0.0.1:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    env: {
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      NODE_ENV: 'test',
      LOG_LEVEL: 'warn',
      JWT_SECRET: 'e2e-secret-e2e-secret-e2e-secret-e2e-0001',
      LOGIN_LIMIT_PER_IP: '1000',
      UPLOAD_DIR: '.data/e2e-uploads',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: mailSmtpPort,
      SMTP_SECURE: 'false',
      MAIL_CAPTURE_URL: `http://127.0.0.1:${mailHttpPort}`,
      // The tests' payment stand-in (scripts/test.sh starts it and points its events at this server).
      STRIPE_API_PORT: process.env.STRIPE_API_PORT ?? '8471',
      RESERVATION_SWEEP_MS: '5000',
      MAIL_RETRY_DELAY_SECONDS: '1',
    },
  },
});
