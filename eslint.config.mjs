import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", ".next-*/**", "node_modules/**", "data/**", "tests/.tmp/**", "next-env.d.ts", "screenshots/**"],
  },
  {
    // The calculation engine is pure TypeScript: no framework, database or Node built-ins.
    files: ["lib/marking/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["next", "next/*", "react", "react-dom", "@/db/*", "../../db/*", "node:*", "fs", "path", "crypto"], message: "lib/marking must stay framework-free and pure." },
          ],
        },
      ],
      "no-restricted-globals": ["error", { name: "Date", message: "lib/marking is deterministic: pass times in." }],
      "no-restricted-properties": ["error", { object: "Math", property: "random", message: "lib/marking is deterministic: take a seeded generator." }],
    },
  },
  {
    // Only the data-access layer talks to the database; components never do.
    files: ["components/**/*.ts", "components/**/*.tsx"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["@/db/*", "drizzle-orm", "drizzle-orm/*", "better-sqlite3"], message: "Components never touch the database; fetch from a route handler or receive props." }] }],
    },
  },
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
];

export default config;
