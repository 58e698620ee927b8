import { defineConfig } from "@playwright/test";

// The app server is started by scripts/test.sh (one build, one server per run).
export default defineConfig({
  testDir: "tests/e2e",
  outputDir: ".data/test-results/e2e-artifacts",
  fullyParallel: true,
  workers: 2,
  retries: 0,
  timeout: 30_000,
  use: {
    baseURL: process.env.BENCHFOLD_TEST_URL ?? "http://localhost:3100",
    screenshot: "only-on-failure",
    trace: "retain-on-failure",
    launchOptions: {
      executablePath: "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--disable-gpu",
        "--disable-dev-shm-usage",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-quic",
        "--no-first-run",
      ],
    },
  },
});
