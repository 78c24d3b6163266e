// Strutwise's own look: high contrast for bright sites, status always in words and icons too.
import type { Config } from "tailwindcss";

export default {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#14161a", soft: "#3b4048", faint: "#6b7280" },
        paper: { DEFAULT: "#f7f6f2", raised: "#ffffff", sunk: "#ebe9e2" },
        brand: { DEFAULT: "#1d4f91", strong: "#143a6b", soft: "#dbe6f5" },
        ok: { DEFAULT: "#136c3a", soft: "#d9f0e1" },
        warn: { DEFAULT: "#8a5a00", soft: "#fbefd0" },
        bad: { DEFAULT: "#b3261e", soft: "#f9dedc" },
      },
      fontFamily: { sans: ["var(--font-inter)", "system-ui", "sans-serif"] },
      minHeight: { touch: "44px" },
      minWidth: { touch: "44px" },
    },
  },
} satisfies Config;
