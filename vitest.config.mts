import { defineConfig } from "vitest/config";

// Unit and integration tests: pure engine tests, database tests on in-memory SQLite,
// and route/service tests. Browser tests live in vitest.e2e.config.ts.
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    alias: { "server-only": new URL("./tests/helpers/empty.ts", import.meta.url).pathname },
  },
  test: {
    include: ["tests/**/*.test.ts", "tests/**/*.test.tsx"],
    exclude: ["tests/e2e/**", "tests/.tmp/**", "node_modules/**"],
    environment: "node",
    testTimeout: 20_000,
    server: { deps: { inline: [] } },
  },
});
