import nextCoreWebVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";
import drizzle from "eslint-plugin-drizzle";

const config = [
  ...nextCoreWebVitals,
  ...nextTypescript,
  {
    plugins: { drizzle },
    rules: {
      "drizzle/enforce-delete-with-where": ["error", { drizzleObjectName: ["db", "tx"] }],
      "drizzle/enforce-update-with-where": ["error", { drizzleObjectName: ["db", "tx"] }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      // Advice for the React Compiler, which this app does not use; TanStack Table is fine without it.
      "react-hooks/incompatible-library": "off",
    },
  },
  {
    // No value from a request, a file or the database is ever made into a pattern (catastrophic
    // backtracking freezes the server). Tests may build patterns from their own constants.
    ignores: ["tests/**", "bench/**"],
    rules: {
      "no-restricted-syntax": [
        "error",
        { selector: "NewExpression[callee.name='RegExp']", message: "Do not build a RegExp at run time: compare strings, or use a fixed pattern literal." },
        { selector: "CallExpression[callee.name='RegExp']", message: "Do not build a RegExp at run time: compare strings, or use a fixed pattern literal." },
      ],
    },
  },
  {
    // The engine is pure: a calculation of its own inputs, runnable from the CLI, a test or a
    // worker. Nothing of the web framework, the UI or the database may reach it.
    files: ["lib/balance/**", "lib/emissions/**"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["next", "next/*", "react", "react/*", "react-dom", "react-dom/*"], message: "The engine (lib/balance, lib/emissions) stays free of the web framework and React." },
            { group: ["drizzle-orm", "drizzle-orm/*", "pg", "@/db", "@/db/*", "**/db/*"], message: "The engine (lib/balance, lib/emissions) never reads the database; its callers pass the figures in." },
            { group: ["server-only", "@/components/*", "@/app/*", "@/lib/ledger/*", "@/lib/lifecycle/*", "@/lib/auth/*", "@/lib/api/*"], message: "The engine (lib/balance, lib/emissions) depends on nothing of the app around it." },
          ],
        },
      ],
    },
  },
  { ignores: [".next/**", ".next-*/**", "node_modules/**", ".data/**", ".run/**", "test-results/**", "next-env.d.ts", "db/migrations/**"] },
];

export default config;
