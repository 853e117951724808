import { defineConfig } from "@playwright/test";

const PORT = Number(process.env.E2E_PORT ?? 3100);
const SMTP_PORT = Number(process.env.E2E_SMTP_PORT ?? 2626);
/** The e2e server gets its own database, uploads and mail folder, prepared by scripts/test-all.ts. */
const serverEnv = {
  DATABASE_PATH: process.env.E2E_DATABASE_PATH ?? "data/e2e/sundocket.db",
  UPLOADS_DIR: "data/e2e/uploads",
  PACKETS_DIR: "data/e2e/packets",
  MAIL_DIR: "data/e2e/mail",
  SMTP_PORT: String(SMTP_PORT),
  SIGNIN_MAX_FAILURES: "5",
  APP_URL: `http://localhost:${PORT}`,
};

/** Set E2E_BASE_URL to run against a server that is already up (a shared dev server); no servers are started then. */
const externalBaseUrl = process.env.E2E_BASE_URL;

export default defineConfig({
  testDir: "tests/e2e",
  outputDir: "test-results",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  // The JSON report is written only when the test runner asks for it (scripts/test-all.ts).
  reporter: process.env.PLAYWRIGHT_JSON_OUTPUT_NAME ? [["list"], ["json"]] : [["list"]],
  use: {
    baseURL: externalBaseUrl ?? `http://localhost:${PORT}`,
    trace: "off",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
      ],
    },
  },
  webServer: externalBaseUrl
    ? []
    : [
        {
          command: "npx tsx scripts/fake-smtp.ts",
          port: SMTP_PORT,
          reuseExistingServer: false,
          env: { ...serverEnv },
        },
        {
          command: `npx next start -H localhost -p ${PORT}`,
          url: `http://localhost:${PORT}/api/health`,
          reuseExistingServer: false,
          timeout: 120_000,
          env: { ...serverEnv },
        },
      ],
});
