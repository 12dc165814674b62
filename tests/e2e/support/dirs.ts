/** Folders the browser tests write to, relative to the project root; all under tests/.tmp/. */
export const E2E_DIRS = {
  root: "tests/.tmp",
  screenshots: "tests/.tmp/screenshots",
  xdgConfig: "tests/.tmp/xdg-config",
  xdgCache: "tests/.tmp/xdg-cache",
  tmp: "tests/.tmp/tmp",
  lock: "tests/.tmp/e2e.lock",
} as const;

/** The build folder of the browser tests (next.config.mjs reads NEXT_DIST_DIR). */
export const E2E_DIST_DIR = ".next-test";
