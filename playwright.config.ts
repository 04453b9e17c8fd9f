import { defineConfig } from '@playwright/test';

// Browser tests run against the production build served by the real server, on a fresh
// SQLite file seeded with the demo, in Debian's Chromium (never a downloaded browser).
const PORT = Number(process.env.E2E_PORT ?? 3111);
const DB_FILE = `./data/e2e-${PORT}.sqlite`;

export default defineConfig({
  testDir: 'e2e',
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [['list']],
  outputDir: 'test-results',
  use: {
    baseURL: `http://localhost:${PORT}`,
    trace: 'retain-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
      ],
    },
  },
  webServer: {
    command: `rm -f ${DB_FILE} ${DB_FILE}-wal ${DB_FILE}-shm && npm run -s build && npx tsx server/index.ts`,
    url: `http://localhost:${PORT}/api/health`,
    timeout: 180_000,
    reuseExistingServer: false,
    env: {
      NODE_ENV: 'production',
      PORT: String(PORT),
      DATABASE_URL: `sqlite:${DB_FILE}`,
      COOKIE_SECURE: 'false',
      RATE_LIMIT_RELAXED: 'true',
    },
  },
});
