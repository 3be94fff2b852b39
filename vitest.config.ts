import path from "node:path";
import { defineConfig } from "vitest/config";

export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // `server-only` refuses to load outside React's server build; data modules are tested directly.
    alias: { "server-only": path.resolve(__dirname, "tests/fixtures/server-only.ts") },
  },
  test: {
    include: ["tests/unit/**/*.test.ts"],
    environment: "node",
    pool: "forks",
    testTimeout: 20_000,
  },
});
