import { defineConfig, devices } from '@playwright/test';

// Runs against the built app (`next start`) on loopback with the test environment that
// scripts/stack.mjs provides; Chromium is Debian's (/usr/bin/chromium), never a download.
const port = Number(process.env.APP_PORT ?? 3100);
const baseURL = `http://127.0.0.1:${port}`;
const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const dbUrl = process.env.DATABASE_URL ?? '';
if (dbUrl && !/@(127\.0\.0\.1|localhost)[:/]/.test(dbUrl))
  throw new Error('e2e tests only run against a database on loopback');

export default defineConfig({
  testDir: 'tests/e2e',
  outputDir: '.data/playwright-output',
  forbidOnly: !!process.env.CI,
  retries: process.env.CI ? 1 : 0,
  workers: 2,
  timeout: 60_000,
  reporter: [
    ['list'],
    ['json', { outputFile: process.env.PLAYWRIGHT_JSON_OUTPUT_NAME ?? '.data/reports/playwright.json' }],
  ],
  use: {
    baseURL,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    // The service worker would answer requests that tests route or break on purpose; the specs
    // about it (tests/e2e/driver/installable.spec.ts) allow it for themselves.
    serviceWorkers: 'block',
    launchOptions: {
      executablePath,
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
      ],
    },
  },
  projects: [{ name: 'chromium', use: { ...devices['Desktop Chrome'] } }],
  webServer: {
    command: `node node_modules/next/dist/bin/next start -H 127.0.0.1 -p ${port}`,
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    env: { NODE_ENV: 'production' },
  },
});
