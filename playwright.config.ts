import { defineConfig, devices } from "@playwright/test";

const port = Number(process.env.APP_PORT ?? 3100);
const baseURL = `http://127.0.0.1:${port}`;

export default defineConfig({
  testDir: "tests/e2e",
  outputDir: "artifacts/e2e-results",
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  use: {
    baseURL,
    screenshot: "on",
    trace: "retain-on-failure",
  },
  projects: [
    {
      name: "debian-chromium",
      use: {
        ...devices["Desktop Chrome"],
        viewport: { width: 1360, height: 900 },
        launchOptions: {
          executablePath: "/usr/bin/chromium",
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
    },
  ],
  webServer: {
    command: `node node_modules/next/dist/bin/next start -p ${port} -H 127.0.0.1`,
    url: `${baseURL}/api/auth/csrf`,
    reuseExistingServer: !process.env.CI,
    timeout: 60_000,
  },
});
