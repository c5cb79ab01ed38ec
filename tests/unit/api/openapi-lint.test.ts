import { createConfig, lintFromString } from "@redocly/openapi-core";
import { describe, expect, it } from "vitest";
import { buildOpenApiDocument } from "@/lib/api-schema/document";

// Redocly's "recommended" rule set; warnings are reported, errors fail.
async function lint(doc: unknown) {
  const config = await createConfig({ extends: ["recommended"] });
  return lintFromString({ source: JSON.stringify(doc), absoluteRef: "openapi.json", config });
}

const describeProblem = (p: Awaited<ReturnType<typeof lint>>[number]) => `${p.ruleId}: ${p.message} at ${p.location.map((l) => l.pointer).join(", ")}`;

describe("the OpenAPI document", () => {
  it("lints with no errors", async () => {
    const problems = await lint(buildOpenApiDocument());
    const warnings = problems.filter((p) => p.severity !== "error");
    if (warnings.length) console.warn(warnings.map(describeProblem).join("\n"));
    expect(problems.filter((p) => p.severity === "error").map(describeProblem)).toEqual([]);
  }, 30_000);

  it("the linter catches a broken document, so a clean run means something", async () => {
    const doc = buildOpenApiDocument();
    (doc.paths["/api/v1/units"]!.get!.responses as Record<string, unknown>)["200"] = { content: { "application/json": { schema: { $ref: "#/components/schemas/Nowhere" } } } };
    const errors = (await lint(doc)).filter((p) => p.severity === "error");
    expect(errors.map((p) => p.ruleId)).toEqual(expect.arrayContaining(["no-unresolved-refs"]));
  }, 30_000);
});
