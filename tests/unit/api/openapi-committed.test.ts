// The committed description (tests/examples/openapi.json) and the client types
// generated from it (fleet-api.d.ts) are what the code generates today, and the
// route serves the same document.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { GET } from "@/app/api/v1/openapi.json/route";
import { DOCUMENT_FILE, TYPES_FILE, generated } from "@/tests/examples/write-openapi";

const stale = "is out of date: run `npm run openapi` and commit the result";

describe("the committed OpenAPI document and client types", () => {
  it("openapi.json is what the code generates", async () => {
    const { document } = await generated();
    expect(readFileSync(DOCUMENT_FILE, "utf8"), `tests/examples/openapi.json ${stale}`).toBe(document);
  }, 30_000);

  it("fleet-api.d.ts is what openapi-typescript generates from it", async () => {
    const { types } = await generated();
    expect(readFileSync(TYPES_FILE, "utf8"), `tests/examples/fleet-api.d.ts ${stale}`).toBe(types);
  }, 30_000);

  it("GET /api/v1/openapi.json serves that document, cacheable by anyone", async () => {
    const res = GET();
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("public, max-age=300");
    expect(`${JSON.stringify(await res.json(), null, 2)}\n`).toBe(readFileSync(DOCUMENT_FILE, "utf8"));
  });
});
