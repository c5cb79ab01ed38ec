// Flat config (ESLint 9), kept as a dotfile so the repository's top level stays as designed.
import next from "eslint-config-next";
import coreWebVitals from "eslint-config-next/core-web-vitals";
import typescript from "eslint-config-next/typescript";

const config = [
  ...next,
  ...coreWebVitals,
  ...typescript,
  {
    rules: {
      "@typescript-eslint/no-explicit-any": "error",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  { ignores: [".next*/**", "node_modules/**", "drizzle/**", "data/**", "tests/.artifacts/**", "mocks/.storage/**", "next-env.d.ts"] },
];

export default config;
