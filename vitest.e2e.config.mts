import path from "node:path";
import { defineConfig } from "vitest/config";

// Browser tests: playwright-core drives Debian's Chromium against a production build served by
// `next start` on a free port with its own fresh database (see tests/e2e/support/global-setup.ts).
// One file at a time: they share that one server.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/e2e/**/*.test.ts"],
    environment: "node",
    globalSetup: ["tests/e2e/support/global-setup.ts"],
    fileParallelism: false,
    // Generous: each test signs in through the real form, and a busy 2-core machine is slow.
    testTimeout: 120_000,
    hookTimeout: 120_000,
    teardownTimeout: 30_000,
    // Chromium and playwright write their profiles, caches and temp files inside the project.
    env: {
      // The same folders as E2E_DIRS in tests/e2e/support/dirs.ts.
      XDG_CONFIG_HOME: path.resolve("tests/.tmp/xdg-config"),
      XDG_CACHE_HOME: path.resolve("tests/.tmp/xdg-cache"),
      TMPDIR: path.resolve("tests/.tmp/tmp"),
    },
  },
});
