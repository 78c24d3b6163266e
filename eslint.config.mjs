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
    ignores: [".next/**", ".next-test*/**", ".next-dev/**", ".data/**", "node_modules/**", "next-env.d.ts", "docker/**"],
  },
];

export default config;
