import { describe, expect, it } from "vitest";
import { buildOpenApiDocument } from "@/lib/api-schema/document";
import { OPERATIONS } from "@/lib/api-schema/operations";
import { PROBLEM_CODES } from "@/lib/api-schema/problem-codes";
import { referenceView, typeText } from "@/lib/api-schema/reference";

describe("the reference page's view of the OpenAPI document", () => {
  const view = referenceView(buildOpenApiDocument());
  const ops = view.tags.flatMap((t) => t.operations);

  it("puts every operation under its tag, once", () => {
    expect(ops.map((o) => o.id).sort()).toEqual(OPERATIONS.map((o) => o.operationId).sort());
    expect(view.tags.every((t) => t.operations.length > 0)).toBe(true);
  });

  it("shows an approval as a fleet reads it: its path parameter, body, answer and refusal codes", () => {
    const decide = ops.find((o) => o.id === "decideLine")!;
    expect(decide).toMatchObject({ method: "POST", path: "/api/v1/lines/{id}/decision", roles: ["approver"], open: false });
    expect(decide.parameters).toEqual([expect.objectContaining({ name: "id", in: "path", required: true, type: "string" })]);
    expect(decide.body).toMatchObject({ mediaType: "application/json", schema: "DecisionInput" });
    expect(decide.answers.find((a) => a.status === "200")).toMatchObject({ schema: "LineDecisionResult", mediaType: "application/json" });
    expect(decide.answers.find((a) => a.status === "409")?.codes).toEqual(expect.arrayContaining(["signing_limit_exceeded", "stale_version"]));
    expect(decide.answers.find((a) => a.status === "401")).toMatchObject({ schema: "Problem", codes: ["unauthenticated"] });
  });

  it("lists every problem code, and the named schemas with their fields", () => {
    expect(view.problemCodes.map((p) => p.code)).toEqual([...PROBLEM_CODES]);
    expect(view.problemCodes.find((p) => p.code === "budget_exceeded")?.operations).toEqual(expect.arrayContaining(["decideLine", "decideLines"]));
    const line = view.schemas.find((s) => s.name === "EstimateLine")!;
    expect(line.fields.find((f) => f.name === "decision")).toMatchObject({ type: "LineDecision or null", required: true });
    expect(view.schemas.find((s) => s.name === "Health")?.fields).toEqual([{ name: "status", type: '"ok"', required: true, description: "" }]);
  });

  it("says a JSON Schema in a few words", () => {
    expect(typeText({ type: ["string", "null"] })).toBe("string or null");
    expect(typeText({ type: "array", items: { $ref: "#/components/schemas/Unit" } })).toBe("list of Unit");
    expect(typeText({ type: "string", format: "date-time" })).toBe("string (date-time)");
    expect(typeText({ enum: ["approve", "decline"] })).toBe('one of "approve", "decline"');
    expect(typeText({ anyOf: [{ $ref: "#/components/schemas/A" }, { type: "null" }] })).toBe("A or null");
    expect(typeText(undefined)).toBe("any");
  });
});
