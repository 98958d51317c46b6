/// <reference types="vitest/config" />
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

export default defineConfig({
  root: "src",
  envDir: "..",
  publicDir: "public",
  plugins: [react(), tailwindcss()],
  build: { outDir: "../dist", emptyOutDir: true, sourcemap: false },
  server: { host: "127.0.0.1", proxy: { "/api": "http://127.0.0.1:3000" } },
  test: {
    root: import.meta.dirname,
    // One MariaDB for all test files: run files one after another so they never race.
    fileParallelism: false,
    testTimeout: 30_000,
    hookTimeout: 60_000,
    setupFiles: ["tests/support/fail-on-console.ts"],
    env: {
      NO_COLOR: "1",
      NODE_ENV: "test",
      DB_NAME: "cellarpact_test",
      BCRYPT_COST: "4",
      LOG_LEVEL: "silent",
      LOGIN_LIMIT_PER_ACCOUNT: "5",
      LOGIN_LIMIT_PER_IP: "1000",
      OUTBOX_RETRY_BASE_MS: "100",
      OUTBOX_POLL_MS: "50",
    },
    projects: [
      { extends: true, test: { name: "unit", include: ["tests/unit/**/*.test.ts"], setupFiles: ["tests/support/fail-on-console.ts"] } },
      // API and browser tests share the test database, rebuilt once before them.
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/api/**/*.test.ts", "tests/e2e/**/*.test.ts"],
          globalSetup: ["tests/support/global-setup.ts"],
          setupFiles: ["tests/support/fail-on-console.ts", "tests/support/demo-rows.ts"],
          testTimeout: 90_000,
        },
      },
    ],
  },
});
