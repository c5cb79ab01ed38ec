import type { Config } from "tailwindcss";

// Cotter's own identity: warm paper, graphite ink, one rust-orange accent.
// Severity is never carried by colour alone (see components/ui/severity-mark.tsx).
// Text colours read at 4.5:1 on every paper and control borders at 3:1 (WCAG 2.2 1.4.3, 1.4.11):
// tests/unit/design/contrast.test.ts checks them.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f1e7", deep: "#ece4d4", card: "#fbf8f2" },
        ink: { DEFAULT: "#2a2a28", soft: "#4f4c46", faint: "#655f55" },
        rule: { DEFAULT: "#d8cdb9", strong: "#8a7d68" },
        rust: { DEFAULT: "#b4501e", deep: "#8c3b12", wash: "#f4e1d3" },
      },
      fontFamily: {
        sans: ['"Atkinson Hyperlegible Next Variable"', "system-ui", "sans-serif"],
      },
      borderRadius: { card: "0.625rem" },
      minHeight: { touch: "2.75rem" },
      minWidth: { touch: "2.75rem" },
    },
  },
};

export default config;
