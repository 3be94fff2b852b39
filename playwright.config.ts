import fs from "node:fs";
import { defineConfig, devices } from "@playwright/test";

/**
 * End-to-end tests against a production build (built by scripts/test.sh), on a fresh database
 * under test-results/. Uses Debian's Chromium where present; elsewhere Playwright's own browser.
 */
const PORT = Number(process.env.E2E_PORT ?? 3100);
const systemChromium = ["/usr/bin/chromium", "/usr/bin/chromium-browser"].find((p) => fs.existsSync(p));

export default defineConfig({
  testDir: "tests/e2e",
  testMatch: "**/*.spec.ts",
  // Only this folder is emptied by Playwright at start; the reports and database live beside it.
  outputDir: "test-results/e2e-artifacts",
  timeout: 90_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 2,
  retries: process.env.CI ? 1 : 0,
  reporter: [["list"], ["json", { outputFile: "test-results/e2e-report.json" }]],
  use: {
    baseURL: `http://localhost:${PORT}`,
    trace: "retain-on-failure",
    // A click that waits longer than this is stuck (see .ci/run), not slow: fail it and let the retry run.
    actionTimeout: 30_000,
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: systemChromium,
      args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run", "--disable-quic"],
    },
  },
  projects: [
    { name: "desktop", use: { ...devices["Desktop Chrome"], viewport: { width: 1280, height: 900 } }, testIgnore: [/phone\.spec\.ts$/, /security-.*\.spec\.ts$/] },
    { name: "phone", use: { ...devices["Desktop Chrome"], viewport: { width: 375, height: 812 }, isMobile: false, hasTouch: true }, testMatch: /phone\.spec\.ts$/ },
    // The authorization matrix and the fuzz test run after the rest, one after the other, so the
    // fuzz test's whole-database fingerprint sees no other writer.
    { name: "security-authz", use: { ...devices["Desktop Chrome"] }, testMatch: /security-authz\.spec\.ts$/, dependencies: ["desktop", "phone"] },
    { name: "security-fuzz", use: { ...devices["Desktop Chrome"] }, testMatch: /security-fuzz\.spec\.ts$/, dependencies: ["security-authz"] },
  ],
  webServer: {
    command: "bash scripts/e2e-server.sh",
    url: `http://localhost:${PORT}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    env: { E2E_PORT: String(PORT) },
    stdout: "ignore",
    stderr: "pipe",
  },
});
