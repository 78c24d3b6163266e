// ESLint: Next.js's recommended rules (React, hooks, accessibility, Core Web Vitals) and TypeScript.
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    // The React Compiler rules of react-hooks 7 flag Date.now() in server components (rendered
    // once per request, where reading the clock is the point) and the form-draft effects that
    // restore what was typed on the phone. Kept visible as warnings, not blocking.
    rules: {
      "react-hooks/purity": "warn",
      "react-hooks/set-state-in-effect": "warn",
      "react-hooks/refs": "warn",
    },
  },
  {
    // The data layer is sealed: only db/** may import the client (`db`, `sql`). Everything else
    // reads and writes through db/queries/<entity>.ts and opens a transaction with
    // `transaction(fn)` from "@/db"; type imports (Tx, DbOrTx) stay allowed.
    files: ["**/*.{ts,tsx,mts,mjs,js}"],
    ignores: [
      "db/**",
      // Outside the app: tests arrange and inspect rows directly, benchmarks fill the database.
      "tests/**",
      "scripts/**",
    ],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          paths: ["@/db", "@/db/index"].map((name) => ({
            name,
            importNames: ["db", "sql"],
            message: "Query through db/queries/<entity>.ts; use `transaction` from \"@/db\" to compose queries in one transaction.",
          })),
          patterns: [
            {
              group: ["**/db", "**/db/index", "!@/db"],
              importNames: ["db", "sql"],
              message: "Query through db/queries/<entity>.ts; use `transaction` from \"@/db\" to compose queries in one transaction.",
            },
          ],
        },
      ],
    },
  },
  {
    ignores: [".next/**", ".next-test*/**", ".next-dev/**", ".data/**", "node_modules/**", "next-env.d.ts", "docker/**"],
  },
];

export default config;
