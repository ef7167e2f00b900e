// End-to-end tests in Debian's Chromium against the server `npm test` builds and starts.
// Playwright never downloads a browser here: executablePath points at /usr/bin/chromium.
import { defineConfig, devices } from '@playwright/test';

const baseURL = process.env.TEST_BASE_URL ?? 'http://127.0.0.1:4329';
const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

// Flags this machine needs: no sandbox as root, and no calls home that its closed network refuses.
const chromiumArgs = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-dev-shm-usage',
];

export default defineConfig({
  testDir: 'tests/e2e',
  timeout: 60_000,
  expect: { timeout: 10_000 },
  workers: 2,
  retries: 0,
  reporter: [['list']],
  use: {
    baseURL,
    trace: 'retain-on-failure',
    launchOptions: { executablePath, args: chromiumArgs },
  },
  projects: [
    {
      name: 'phone',
      testMatch: /\.(phone|both)\.spec\.ts$/,
      use: { ...devices['Pixel 7'], viewport: { width: 390, height: 844 }, browserName: 'chromium' },
    },
    {
      name: 'desk',
      testMatch: /\.(desk|both)\.spec\.ts$/,
      use: { browserName: 'chromium', viewport: { width: 1440, height: 900 } },
    },
  ],
});
