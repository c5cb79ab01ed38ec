// Flat config (ESLint 9), kept as a dotfile so the repository's top level stays as designed.
import fs from "node:fs";
import path from "node:path";
import next from "eslint-config-next";
import coreWebVitals from "eslint-config-next/core-web-vitals";
import typescript from "eslint-config-next/typescript";

// ---- Layers (DEVELOPERS.md, "Layers"): which folder may import what. ----
// One rule per folder, because a file that matches two blocks gets only the
// later block's options for the same rule: each list below is complete.
// tests/unit/layer-rules.test.ts lints snippets at paths in each folder, so
// these rules cannot quietly stop matching.

/** The local fakes are for tests and `npm run mocks`; the app reaches them through the real SDKs. */
const mocks = [
  { group: ["@/mocks", "@/mocks/**"], message: "Only tests and mocks/start.ts import the fakes; the app reaches them through the real SDKs." },
  { regex: "^(\\.{1,2}/)+mocks(/|$)", message: "Only tests and mocks/start.ts import the fakes; the app reaches them through the real SDKs." },
];

/** Server glue: database, mail, payments, uploads, sessions. */
const serverGlue = (allowTypeImports, message) => [
  { group: ["@/lib/server", "@/lib/server/**"], allowTypeImports, message },
  { regex: "^(\\.{1,2}/)+server(/|$)", allowTypeImports, message },
];
const database = (allowTypeImports, message) => [
  { group: ["@/db", "@/db/**"], allowTypeImports, message },
  { regex: "^(\\.{1,2}/)+db(/|$)", allowTypeImports, message },
];
const hostedServices = (message) => [
  { regex: packages("stripe", "nodemailer", "uploadthing", "@uploadthing/[^/]+"), allowTypeImports: true, message },
];

/** Bare package names (a group like "stripe" would also match any path with a folder of that name). */
const packages = (...names) => `^(${names.join("|")})(/.*)?$`;

const pureLib = [
  ...serverGlue(false, "lib/ outside lib/server/ is pure: server glue goes in lib/server/, which may import lib/, never the other way."),
  ...database(false, "lib/ outside lib/server/ is pure: reading or writing the database belongs in db/queries or lib/server/."),
  {
    regex: packages("next", "next-auth", "react", "react-dom"),
    message: "lib/ outside lib/server/ has no framework imports, so a test or a script can use it without a server.",
  },
  {
    regex: packages("drizzle-orm", "@libsql/[^/]+", "nodemailer", "stripe", "uploadthing", "server-only"),
    message: "lib/ outside lib/server/ does no I/O: database, mail, payments and uploads are server glue (lib/server/).",
  },
  {
    regex: packages("(node:)?(fs|net|http|https|child_process)"),
    message: "lib/ outside lib/server/ does no I/O.",
  },
  ...mocks,
];

const dbLayer = [
  ...serverGlue(true, "db/ is schema, client and queries: it may name a server type, never call server glue. Pass a callback (notify) instead."),
  ...hostedServices("db/ makes no network calls: hosted services are called from lib/server/ (types are fine)."),
  ...mocks,
];

const clientCode = [
  {
    group: ["@/lib/server/**", "!@/lib/server/actions", "!@/lib/server/actions/**"],
    allowTypeImports: true,
    message: "Client code may import server actions (lib/server/actions) and types; other server glue stays on the server.",
  },
  ...database(true, "Client code gets its data as props or from the API; only types may come from db/."),
  ...mocks,
];

/**
 * Client code is every file that starts with "use client", wherever it lives: components/ also
 * holds async server components that load their own data (and may), so a folder glob would be
 * either too loose or too strict. Found on disk each run, so a new client file is covered at once.
 */
function clientFiles(...dirs) {
  const found = [];
  const walk = (dir) => {
    for (const entry of fs.readdirSync(path.join(import.meta.dirname, dir), { withFileTypes: true })) {
      const rel = `${dir}/${entry.name}`;
      if (entry.isDirectory()) walk(rel);
      else if (/\.tsx?$/.test(entry.name) && /^\s*(?:\/\/[^\n]*\n\s*|\/\*[\s\S]*?\*\/\s*)*["']use client["']/.test(fs.readFileSync(path.join(import.meta.dirname, rel), "utf8").slice(0, 2000))) found.push(rel.replace(/[[\]()*?{}!+@]/g, "\\$&")); // a literal path, not a glob
    }
  };
  for (const dir of dirs) walk(dir);
  return found;
}

const restrict = (patterns) => ({ "@typescript-eslint/no-restricted-imports": ["error", { patterns }] });

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
  // Type-aware rules: a promise nobody awaits loses its error and its ordering.
  {
    files: ["**/*.ts", "**/*.tsx"],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      "@typescript-eslint/no-floating-promises": "error",
      // `attributes: false`: an async onSubmit/onClick is how a form posts with fetch, React ignores
      // what it returns, and the five such handlers catch their own failures and show them on the form.
      "@typescript-eslint/no-misused-promises": ["error", { checksVoidReturn: { attributes: false } }],
    },
  },
  { files: ["lib/**/*.{ts,tsx}"], ignores: ["lib/server/**"], rules: restrict(pureLib) },
  { files: ["lib/server/**/*.{ts,tsx}", "app/**/*.{ts,tsx}", "*.ts"], rules: restrict(mocks) },
  { files: ["db/**/*.ts"], rules: restrict(dbLayer) },
  // The demo-data script runs before `npm run mocks`, so it starts a short-lived upload fake
  // of its own and stores the demo photos through the SDK: the one script in db/ that may.
  { files: ["db/seed/demo-photos.ts"], rules: restrict(serverGlue(true, "db/ never calls server glue.")) },
  { files: ["components/**/*.{ts,tsx}"], rules: restrict(mocks) },
  { files: clientFiles("app", "components"), rules: restrict(clientCode) },
  { ignores: [".next*/**", "node_modules/**", "drizzle/**", "data/**", "tests/.artifacts/**", "mocks/.storage/**", "next-env.d.ts"] },
];

export default config;
