import { defineConfig } from '@playwright/test';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/*
 * End-to-end tests drive Debian's Chromium (/usr/bin/chromium; never a downloaded browser) against the
 * real server, which serves the built app (run `npm run build` first; `npm test` does) with a fresh
 * SQLite database in a temporary folder and the local fake mail server.
 * Workers inherit the environment, so the folder and ports are chosen once, here, in the main process.
 */
process.env['SW_E2E_DATA_DIR'] ??= mkdtempSync(join(tmpdir(), 'seamwright-e2e-'));
process.env['SW_E2E_PORT'] ??= '4300';
process.env['SW_E2E_SMTP_PORT'] ??= '2525';
process.env['SW_E2E_MAIL_HTTP_PORT'] ??= '2580';
process.env['SW_E2E_STRIPE_PORT'] ??= '2611';

const port = Number(process.env['SW_E2E_PORT']);
const smtpPort = process.env['SW_E2E_SMTP_PORT'];
const mailHttpPort = process.env['SW_E2E_MAIL_HTTP_PORT'];

/** Base URL of the server under test. */
export const baseURL = `http://127.0.0.1:${port}`;
/** Base URL of the fake mail server's HTTP inbox. */
export const mailInboxURL = `http://127.0.0.1:${mailHttpPort}`;
/** Base URL of the local fake payment provider (API, hosted checkout, `/_fake/events`), and its keys. */
export const fakeStripeURL = `http://127.0.0.1:${process.env['SW_E2E_STRIPE_PORT']}`;
export const stripeKeys = { STRIPE_SECRET_KEY: 'sk_test_seamwright_e2e', STRIPE_WEBHOOK_SECRET: 'whsec_seamwright_e2e' };

export default defineConfig({
  testDir: 'e2e',
  testMatch: '**/*.spec.ts',
  outputDir: 'test-results/playwright',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: process.env['CI'] ? [['list'], ['json', { outputFile: 'test-results/playwright.json' }]] : 'list',
  use: {
    baseURL,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium',
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
  webServer: [
    {
      command: 'npx tsx server/dev/fake-mail-server.ts',
      url: `${mailInboxURL}/api/messages`,
      reuseExistingServer: false,
      timeout: 60_000,
      env: { FAKE_SMTP_PORT: smtpPort, FAKE_MAIL_HTTP_PORT: mailHttpPort },
    },
    {
      command: 'npx tsx server/dev/fake-stripe-server.ts',
      url: `${fakeStripeURL}/_fake/health`,
      reuseExistingServer: false,
      timeout: 60_000,
      env: { ...stripeKeys, FAKE_STRIPE_PORT: process.env['SW_E2E_STRIPE_PORT']!, FAKE_STRIPE_WEBHOOK_URL: `${baseURL}/api/shop/webhook` },
    },
    {
      command: 'npm run start:server',
      url: `${baseURL}/api/health`,
      reuseExistingServer: false,
      timeout: 120_000,
      env: {
        PORT: String(port),
        HOST: '127.0.0.1',
        NODE_ENV: 'test',
        SEAMWRIGHT_DATA_DIR: process.env['SW_E2E_DATA_DIR']!,
        SMTP_HOST: '127.0.0.1',
        SMTP_PORT: smtpPort,
        MAIL_INBOX_URL: mailInboxURL,
        PUBLIC_URL: baseURL,
        // Every browser test signs up from 127.0.0.1, more than a real address would in the window;
        // the limits themselves are tested against the server (server/password-reset.spec.ts, auth.spec.ts).
        SIGNUP_LIMIT_PER_ADDRESS: '1000',
        SIGNIN_LIMIT_PER_ADDRESS: '1000',
        ...stripeKeys,
        STRIPE_API_BASE: fakeStripeURL,
      },
    },
  ],
});
