import { ESLint } from "eslint";
import { beforeAll, describe, expect, it } from "vitest";

/**
 * The layer rules in .eslint.config.mjs (DEVELOPERS.md, "Layers"), checked by
 * linting small snippets as if they sat at a path in each folder: a wrong
 * import must be reported, a right one must not. Without this a typo in a
 * glob would switch a rule off and `npm run lint` would stay green.
 */

const RULE = "@typescript-eslint/no-restricted-imports";

let eslint: ESLint;

beforeAll(() => {
  eslint = new ESLint({
    cwd: process.cwd(),
    overrideConfigFile: ".eslint.config.mjs",
    // The snippets sit at paths that need not exist; the type-aware rules (not under test here)
    // would need them in the TypeScript project, so they are off for these runs.
    overrideConfig: [
      {
        files: ["**/*.ts", "**/*.tsx"],
        languageOptions: { parserOptions: { projectService: false } },
        rules: { "@typescript-eslint/no-floating-promises": "off", "@typescript-eslint/no-misused-promises": "off" },
      },
    ],
  });
});

async function restricted(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(`${code}\nexport const used = [x];\n`, { filePath });
  expect(result?.messages.filter((m) => m.fatal)).toEqual([]);
  return (result?.messages ?? []).filter((m) => m.ruleId === RULE).map((m) => m.message);
}

// [folder, path of a snippet there, imports it may not make, imports it may]
const cases: { where: string; filePath: string; wrong: string[]; right: string[] }[] = [
  {
    where: "pure lib/",
    filePath: "lib/layer-probe.ts",
    wrong: [
      'import { x } from "@/lib/server/mail/send";',
      'import { x } from "./server/mail/send";',
      'import { x } from "@/db/client";',
      'import { x } from "../db/schema";',
      'import type { x } from "@/db/queries/units";',
      'import { x } from "next/navigation";',
      'import { x } from "react";',
      'import { x } from "@/mocks/stripe/server";',
      'import { x } from "../mocks/stripe/server";',
      'import { x } from "node:fs";',
      'import { x } from "drizzle-orm";',
      'import { x } from "stripe";',
      'import "server-only";',
    ],
    right: [
      'import { x } from "@/lib/money";',
      'import { x } from "./money";',
      'import { x } from "zod";',
      'import { x } from "node:crypto";',
      'import { x } from "@/lib/server-side-note";',
    ],
  },
  {
    where: "pure lib/ in a subfolder",
    filePath: "lib/uploads/layer-probe.ts",
    wrong: ['import { x } from "../server/uploads/ut-api";', 'import { x } from "@/lib/server/uploads/ut-api";', 'import { x } from "@/mocks/uploadthing/server";'],
    right: ['import { x } from "./photo-rules";', 'import { x } from "@/lib/env";'],
  },
  {
    where: "lib/server/",
    filePath: "lib/server/layer-probe.ts",
    wrong: ['import { x } from "@/mocks/uploadthing/token";', 'import { x } from "../../mocks/smtp/server";'],
    right: ['import { x } from "@/db/client";', 'import { x } from "next/headers";', 'import { x } from "stripe";', 'import { x } from "@/lib/server/mail/send";'],
  },
  {
    where: "db/",
    filePath: "db/queries/layer-probe.ts",
    wrong: [
      'import { x } from "@/lib/server/mail/send";',
      'import { x } from "@/lib/server/payments/stripe";',
      'import { x } from "stripe";',
      'import { x } from "nodemailer";',
      'import { x } from "uploadthing/server";',
      'import { x } from "@/mocks/stripe/server";',
    ],
    right: [
      'import type { x } from "@/lib/server/mail/send";',
      'import type { x } from "stripe";',
      'import { x } from "@/lib/money";',
      'import { x } from "./scope";',
      'import { x } from "drizzle-orm";',
      'import { x } from "./stripe-events";',
    ],
  },
  {
    where: "app/",
    filePath: "app/(shop)/layer-probe/page.tsx",
    wrong: ['import { x } from "@/mocks/stripe/server";', 'import { x } from "../../../mocks/stripe/server";'],
    right: ['import { x } from "@/db/queries/units";', 'import { x } from "@/lib/server/auth/page-access";'],
  },
  {
    where: "a server component in components/",
    filePath: "components/layer-probe.tsx",
    wrong: ['import { x } from "@/mocks/stripe/server";'],
    right: ['import { x } from "@/db/queries/occurrences";', 'import { x } from "@/lib/server/auth/current-user";'],
  },
  {
    // The client list is found on disk ("use client" first); this file is one of them.
    where: 'a "use client" component',
    filePath: "components/auth/sign-in-form.tsx",
    wrong: [
      'import { x } from "@/db/queries/work-order-view";',
      'import { x } from "@/lib/server/auth/guarded-action";',
      'import { x } from "@/lib/server/mail/send";',
      'import { x } from "@/mocks/stripe/server";',
    ],
    right: [
      'import type { x } from "@/db/queries/work-order-view";',
      'import type { x } from "@/lib/server/auth/guarded-action";',
      'import { x } from "@/lib/server/actions/invoices";',
      'import { x } from "@/lib/format";',
    ],
  },
];

describe("layer rules (.eslint.config.mjs)", () => {
  for (const c of cases) {
    describe(c.where, () => {
      for (const code of c.wrong) {
        it(`reports ${code}`, async () => {
          expect(await restricted(c.filePath, code)).not.toEqual([]);
        });
      }
      for (const code of c.right) {
        it(`allows ${code}`, async () => {
          expect(await restricted(c.filePath, code)).toEqual([]);
        });
      }
    });
  }

  it('"use client" files are covered: the sign-in form is one, so the client rule is not matching nothing', async () => {
    const config = (await eslint.calculateConfigForFile("components/auth/sign-in-form.tsx")) as { rules: Record<string, unknown> };
    expect(JSON.stringify(config.rules[RULE])).toContain("@/lib/server/actions");
  });
});
