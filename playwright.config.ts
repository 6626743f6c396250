import { defineConfig, devices } from "@playwright/test";

const PORT = Number(process.env.E2E_PORT ?? 3210);
export const E2E = {
  port: PORT,
  baseURL: `http://localhost:${PORT}`,
  databaseUrl: "file:./data/e2e.db",
  smtpPort: Number(process.env.E2E_SMTP_PORT ?? 2626),
  /** Failed sign-ins per client address per 15 minutes (the app's default, stated for the security spec). */
  signInRateLimit: 30,
};

/** The shared secret the e2e server's POST /api/cron/tick accepts. */
export const CRON_SECRET_FOR_E2E = "e2e-cron-secret-0123456789";

const launchOptions = {
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
};

export default defineConfig({
  testDir: "tests/e2e",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"]],
  outputDir: "test-results/e2e",
  use: { baseURL: E2E.baseURL, launchOptions, trace: "off", screenshot: "only-on-failure" },
  projects: [
    { name: "api", testMatch: /api\..*spec\.ts/, use: { launchOptions } },
    { name: "laptop", testMatch: /ui\..*spec\.ts/, use: { ...devices["Desktop Chrome"], viewport: { width: 1366, height: 900 }, launchOptions } },
    { name: "phone", testMatch: /ui\.(views|mail|runs|my-work|drift)\.spec\.ts/, use: { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2, launchOptions } },
  ],
  webServer: {
    command: "node --import tsx --import ./scripts/_shims/server-only.mjs scripts/e2e-server.mts",
    url: `${E2E.baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: "ignore",
    stderr: "pipe",
    env: {
      DATABASE_URL: E2E.databaseUrl,
      PORT: String(PORT),
      SMTP_SINK: "on",
      SMTP_SINK_PORT: String(E2E.smtpPort),
      SMTP_URL: `smtp://127.0.0.1:${E2E.smtpPort}`,
      DEMO_MODE: "on",
      AUTH_SECRET: "e2e-secret-for-tests-only-0123456789",
      CRON_SECRET: CRON_SECRET_FOR_E2E,
      SIGN_IN_RATE_LIMIT: String(E2E.signInRateLimit),
      AUTH_URL: E2E.baseURL,
      NODE_ENV: "production",
    },
  },
});
