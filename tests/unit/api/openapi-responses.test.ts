// The checker the integration tests hold every /api/v1 answer to
// (tests/support/openapi-responses.ts) refuses what the document does not say.
import { describe, expect, it } from "vitest";
import { buildOpenApiDocument } from "@/lib/api-schema/document";
import { checkApiAnswer, responseChecker } from "@/tests/support/openapi-responses";

const checker = responseChecker(buildOpenApiDocument());
const json = "application/json";
const problem = { type: "urn:cotter:problem:not_found", title: "Not found", status: 404, detail: "That unit was not found.", code: "not_found" };

describe("holding an answer to the OpenAPI document", () => {
  it("passes answers the document describes", () => {
    expect(checker.check({ method: "GET", url: "/api/v1/units?inShop=true", status: 200, contentType: json, body: { units: [], nextCursor: null } })).toBe("GET /api/v1/units → 200");
    expect(checker.check({ method: "GET", url: "/api/v1/units/un_1", status: 404, contentType: "application/problem+json", body: problem })).toBe("GET /api/v1/units/{id} → 404");
    expect(checker.check({ method: "POST", url: "/api/v1/invitations/accept", status: 201, contentType: json, body: { id: "u1", email: "a@b.example", role: "viewer", accountId: null } })).toBe(
      "POST /api/v1/invitations/accept → 201",
    );
  });

  it("refuses a field the document does not have, a missing one and a wrong type", () => {
    expect(() => checker.check({ method: "GET", url: "/api/v1/units", status: 200, contentType: json, body: { units: [], nextCursor: null, total: 3 } })).toThrow(/additional properties \(total\)/);
    expect(() => checker.check({ method: "GET", url: "/api/v1/units", status: 200, contentType: json, body: { units: [] } })).toThrow(/nextCursor/);
    expect(() => checker.check({ method: "GET", url: "/api/v1/me", status: 200, contentType: json, body: { id: "u1", name: "A", email: "a@b.example", role: "boss", accountId: null } })).toThrow(/\/role/);
  });

  it("refuses a status, a media type, a problem code and an operation the document does not have", () => {
    expect(() => checker.check({ method: "GET", url: "/api/v1/me", status: 418, contentType: json, body: {} })).toThrow(/does not describe this status/);
    expect(() => checker.check({ method: "GET", url: "/api/v1/invoices/in_1/pdf", status: 200, contentType: "text/html", body: "" })).toThrow(/answered text\/html/);
    expect(() => checker.check({ method: "GET", url: "/api/v1/units/un_1", status: 404, contentType: "application/problem+json", body: { ...problem, code: "gone_fishing" } })).toThrow(/\/code/);
    expect(() => checker.check({ method: "GET", url: "/api/v1/widgets", status: 200, contentType: json, body: {} })).toThrow(/no such operation/);
    expect(() => checker.check({ method: "DELETE", url: "/api/v1/units", status: 200, contentType: json, body: {} })).toThrow(/no such operation/);
  });

  it("leaves paths outside /api/v1 alone", () => {
    expect(checkApiAnswer({ method: "POST", url: "http://localhost:3000/api/webhooks/stripe", status: 200, contentType: json, body: {} })).toBe(false);
    expect(checkApiAnswer({ method: "GET", url: "http://localhost:3000/api/v1/health", status: 200, contentType: json, body: { status: "ok" } })).toBe(true);
  });
});
