import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { buildOpenApiDocument } from "@/lib/api-schema/document";
import { OPERATIONS } from "@/lib/api-schema/operations";
import { appRoutes } from "@/tests/support/app-tree";

const root = path.join(import.meta.dirname, "..", "..", "..");

/** `/api/v1/units/[id]` as OpenAPI writes it: `/api/v1/units/{id}`. */
const toOpenApiPath = (pattern: string) => pattern.replace(/\[([^\]]+)\]/g, "{$1}");

const apiRoutes = appRoutes().filter((r) => r.kind === "api" && r.pattern.startsWith("/api/v1/"));

describe("the OpenAPI document and app/api/v1", () => {
  const doc = buildOpenApiDocument();
  const documented = Object.entries(doc.paths).flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m.toUpperCase()} ${p}`));
  const served = apiRoutes.flatMap((r) => r.methods.map((m) => `${m} ${toOpenApiPath(r.pattern)}`));

  it("finds the routes at all", () => {
    expect(served).toEqual(expect.arrayContaining(["GET /api/v1/units", "POST /api/v1/lines/{id}/decision", "GET /api/v1/openapi.json"]));
  });

  it("describes every method of every route.ts", () => {
    expect(served.filter((s) => !documented.includes(s)).sort()).toEqual([]);
  });

  it("describes nothing that no route.ts serves", () => {
    expect(documented.filter((d) => !served.includes(d)).sort()).toEqual([]);
  });

  it("names each path parameter as the path does", () => {
    const wrong = OPERATIONS.filter((op) => {
      const inPath = [...op.path.matchAll(/\{([^}]+)\}/g)].map((m) => m[1]).sort();
      const inSchema = Object.keys(op.params?.shape ?? {}).sort();
      return JSON.stringify(inPath) !== JSON.stringify(inSchema);
    });
    expect(wrong.map((op) => op.path)).toEqual([]);
  });

  it("has one operationId per operation", () => {
    const ids = OPERATIONS.map((op) => op.operationId);
    expect(ids.filter((id, i) => ids.indexOf(id) !== i)).toEqual([]);
  });
});

/** Every zod schema exported from lib/validation, by the name it is exported as. */
async function validationExports(): Promise<Map<unknown, string>> {
  const names = new Map<unknown, string>();
  const dir = path.join(root, "lib", "validation");
  for (const file of readdirSync(dir).filter((f) => f.endsWith(".ts"))) {
    const mod = (await import(`@/lib/validation/${file.replace(/\.ts$/, "")}`)) as Record<string, unknown>;
    for (const [name, value] of Object.entries(mod)) if (!names.has(value)) names.set(value, name);
  }
  return names;
}

describe("each route parses what its operation says it takes", () => {
  it("passes the same body, query and params schemas to apiRoute / publicRoute", async () => {
    const names = await validationExports();
    const mismatches: string[] = [];
    for (const op of OPERATIONS) {
      const route = apiRoutes.find((r) => toOpenApiPath(r.pattern) === op.path);
      if (!route) continue;
      const source = readFileSync(path.join(root, route.file), "utf8");
      const inputs: [string, unknown][] = [
        ["body", op.body && "safeParse" in op.body.schema ? op.body.schema : undefined],
        ["query", op.query],
        ["params", op.params],
      ];
      for (const [key, schema] of inputs) {
        if (!schema) continue;
        const name = names.get(schema as z.ZodType);
        if (!name) mismatches.push(`${op.operationId}: its ${key} schema is not exported from lib/validation`);
        else if (!new RegExp(`\\b${key}: ${name}\\b|\\b${name} as ${key}\\b`).test(source)) mismatches.push(`${op.operationId}: ${route.file} does not parse its ${key} with ${name}`);
      }
    }
    expect(mismatches).toEqual([]);
  });
});
