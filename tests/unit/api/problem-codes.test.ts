import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { PROBLEM_CODES, isProblemCode } from "@/lib/api-schema/problem-codes";

const root = `${import.meta.dirname}/../../..`;

// The codes api-v1.md names, section by section (Conventions; Intake "Errors added"; Decision errors).
const CONTRACT_CODES = [
  "invalid_input",
  "not_found",
  "forbidden",
  "unauthenticated",
  "unit_in_shop",
  "invitation_expired",
  "invitation_used",
  "signing_limit_exceeded",
  "budget_exceeded",
  "stale_version",
  "not_pending",
];

/** Codes the README's Fleet API section promises: "409 `x`", "`x` (409)" and "410 `x` / `y`". */
function readmeCodes(): string[] {
  const readme = readFileSync(`${root}/README.md`, "utf8");
  const section = readme.slice(readme.indexOf("## Fleet API"), readme.indexOf("\n## ", readme.indexOf("## Fleet API") + 1));
  const codes = new Set<string>();
  for (const m of section.matchAll(/\b[45]\d\d `([a-z_]+)`(?: \/ `([a-z_]+)`)?/g)) [m[1], m[2]].forEach((c) => c && codes.add(c));
  for (const m of section.matchAll(/`([a-z_]+)` \([45]\d\d/g)) codes.add(m[1]!);
  return [...codes].sort();
}

describe("ProblemCode", () => {
  it("lists every code the API contract names", () => {
    expect(CONTRACT_CODES.filter((c) => !isProblemCode(c))).toEqual([]);
  });

  it("lists every code the README's Fleet API section names", () => {
    const codes = readmeCodes();
    // The parser must find the section's codes at all, or this test would pass on an empty list.
    expect(codes).toEqual(expect.arrayContaining(["invitation_withdrawn", "reset_used", "lines_pending", "malformed_url", "payment_service_unavailable", "reset_expired"]));
    expect(codes.filter((c) => !isProblemCode(c))).toEqual([]);
  });

  it("is snake_case and has no duplicates", () => {
    expect(PROBLEM_CODES.filter((c) => !/^[a-z]+(_[a-z]+)*$/.test(c))).toEqual([]);
    expect(new Set(PROBLEM_CODES).size).toBe(PROBLEM_CODES.length);
  });

  it("refuses a string that is not a code", () => {
    expect(isProblemCode("something_new")).toBe(false);
  });
});
