import type { Config } from "tailwindcss";

// Cotter's own identity: warm paper, graphite ink, one rust-orange accent.
// Severity is never carried by colour alone (see components/ui/severity-mark.tsx).
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f1e7", deep: "#ece4d4", card: "#fbf8f2" },
        ink: { DEFAULT: "#2a2a28", soft: "#4f4c46", faint: "#6e685e" },
        rule: { DEFAULT: "#d8cdb9", strong: "#b9ab93" },
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
