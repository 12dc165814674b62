// Runs in the browser before any of the app's code. Zod 4 speeds up parsing by compiling code
// with `new Function`, after first probing whether eval is allowed; under Meniscus's
// Content-Security-Policy it is not, and even the caught probe is reported as a policy violation.
// Telling zod not to try (its `jitless` setting, kept on globalThis.__zod_globalConfig, which
// `z.config()` writes too) keeps the browser's console clean. The server keeps the fast path.
const g = globalThis as unknown as { __zod_globalConfig?: Record<string, unknown> };
g.__zod_globalConfig = Object.assign(g.__zod_globalConfig ?? {}, { jitless: true });

export {};
