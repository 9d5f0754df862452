import { defineConfig, devices } from '@playwright/test';

// Debian's Chromium, never a downloaded browser. The background-networking flags keep it from dialling out
// on a closed network.
const CHROMIUM = '/usr/bin/chromium';
const port = Number(process.env.E2E_PORT ?? 3100);
const baseURL = `http://127.0.0.1:${port}`;
const workerPort = Number(process.env.E2E_WORKER_HEALTH_PORT ?? 3199);

export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '**/*.spec.ts',
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: process.env.CI ? [['list']] : [['list'], ['html', { open: 'never' }]],
  outputDir: 'test-results',
  use: {
    baseURL,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    testIdAttribute: 'data-testid',
  },
  projects: [
    {
      name: 'chromium',
      use: {
        ...devices['Desktop Chrome'],
        launchOptions: {
          executablePath: CHROMIUM,
          args: [
            '--no-sandbox',
            '--disable-gpu',
            '--disable-quic',
            '--no-first-run',
            '--disable-background-networking',
            '--disable-component-update',
            '--disable-sync',
          ],
        },
      },
    },
  ],
  webServer: [
    {
      // The production web server as `npm start` runs it: Next plus the participant-answer fast path (server/serve.ts).
      command: `node --conditions=react-server --import tsx server/serve.ts --hostname 127.0.0.1 --port ${port}`,
      url: `${baseURL}/api/health`,
      reuseExistingServer: !process.env.CI,
      timeout: 120_000,
      stdout: 'pipe',
      stderr: 'pipe',
      env: {
        ...(process.env as Record<string, string>),
        DATABASE_URL: process.env.E2E_DATABASE_URL ?? process.env.DATABASE_URL ?? '',
        APP_URL: baseURL,
        NEXTAUTH_URL: baseURL,
        EPICYCLE_ENV: 'local',
        NODE_ENV: 'production',
      },
    },
    {
      // A pack worker on the e2e database, as `npm start` runs one beside the web server.
      command: `node --conditions=react-server --import tsx scripts/worker.ts`,
      url: `http://127.0.0.1:${workerPort}/`,
      reuseExistingServer: !process.env.CI,
      timeout: 120_000,
      stdout: 'pipe',
      stderr: 'pipe',
      env: {
        ...(process.env as Record<string, string>),
        DATABASE_URL: process.env.E2E_DATABASE_URL ?? process.env.DATABASE_URL ?? '',
        APP_URL: baseURL,
        EPICYCLE_ENV: 'local',
        WORKER_HEALTH_PORT: String(workerPort),
      },
    },
  ],
});
