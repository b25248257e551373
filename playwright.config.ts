import { defineConfig } from '@playwright/test';

// Browser tests drive Debian's Chromium (never a downloaded browser build)
// against the app that `npm test` serves; SKYWELL_BASE_URL says where.
export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '**/*.spec.ts',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  // Generous: CI shares two cores between the app, a render worker and software-rendered Chromium.
  timeout: 120_000,
  expect: { timeout: 15_000 },
  reporter: [['list']],
  outputDir: '.data/test/playwright-results',
  use: {
    baseURL: process.env.SKYWELL_BASE_URL ?? 'http://localhost:3100',
    viewport: { width: 1280, height: 800 },
    trace: 'retain-on-failure',
    navigationTimeout: 30_000,
    actionTimeout: 20_000,
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--no-sandbox', '--disable-background-networking', '--disable-component-update', '--disable-sync',
        '--no-first-run', '--disable-quic', '--use-angle=swiftshader', '--enable-unsafe-swiftshader',
      ],
    },
  },
});
