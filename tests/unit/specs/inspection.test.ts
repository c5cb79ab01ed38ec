import { describe, expect, it } from "vitest";
import { annualInspectionDueDate, checkReading } from "@/lib/specs";
import type { InspectionBasis } from "@/lib/specs";

const due = (lastInspection: string, today: string, basis: InspectionBasis = "periodic") =>
  checkReading({ kind: "annual_inspection", lastInspection, today, basis });

describe("annual inspection due date — 49 CFR 396.17(c): every 12 months", () => {
  it("49 CFR 396.17(c): inspected 2024-03-15 → due 2025-03-15", () => {
    expect(annualInspectionDueDate("2024-03-15", "periodic")).toBe("2025-03-15");
    const r = due("2024-03-15", "2024-09-01");
    expect(r).toMatchObject({ verdict: "within", source: "49 CFR 396.17(c)", sourceKind: "published", unit: "days" });
    expect(r.limit).toContain("due 2025-03-15");
  });

  it("49 CFR 396.17(c): 29 February runs to 28 February the next year", () => {
    expect(annualInspectionDueDate("2024-02-29", "periodic")).toBe("2025-02-28");
  });
});

describe("state inspection — 49 CFR 396.17(f): 12 months from the last day of the month inspected", () => {
  it("49 CFR 396.17(f): inspected 2024-03-15 → counts until 2025-03-31", () => {
    expect(annualInspectionDueDate("2024-03-15", "state")).toBe("2025-03-31");
    expect(due("2024-03-15", "2025-03-01", "state")).toMatchObject({ value: 30, verdict: "at_limit", source: "49 CFR 396.17(f)" });
  });

  it("49 CFR 396.17(f): a February 2024 (leap year) inspection counts until 2025-02-28", () => {
    expect(annualInspectionDueDate("2024-02-03", "state")).toBe("2025-02-28");
    expect(annualInspectionDueDate("2023-02-03", "state")).toBe("2024-02-29");
  });

  it("49 CFR 396.17(f): the same day gives a later due date than 396.17(c)", () => {
    expect(due("2024-03-15", "2025-03-20", "periodic").verdict).toBe("beyond");
    expect(due("2024-03-15", "2025-03-20", "state").verdict).toBe("at_limit");
  });
});

describe("days left and the 30-day warning (common practice)", () => {
  it("common practice edge: 31 days left → within", () => {
    expect(due("2024-03-15", "2025-02-12")).toMatchObject({ value: 31, verdict: "within" });
  });

  it("common practice edge: exactly 30 days left → at_limit", () => {
    expect(due("2024-03-15", "2025-02-13")).toMatchObject({ value: 30, verdict: "at_limit" });
  });

  it("49 CFR 396.17 edge: due today (0 days) → at_limit, still inspected", () => {
    const r = due("2024-03-15", "2025-03-15");
    expect(r).toMatchObject({ value: 0, verdict: "at_limit", limitValue: 0 });
    expect(r.note).toMatch(/^due today/);
  });

  it("49 CFR 396.17 edge: one day past due → beyond", () => {
    const r = due("2024-03-15", "2025-03-16");
    expect(r).toMatchObject({ value: -1, verdict: "beyond" });
    expect(r.note).toMatch(/^1 days past due/);
  });

  it("counts across a leap day exactly (2024-01-10 → 2024-03-10 is 60 days)", () => {
    expect(due("2023-03-10", "2024-01-10")).toMatchObject({ value: 60 });
  });

  it("says the 30-day warning is common practice", () => {
    expect(due("2024-03-15", "2024-04-01").note).toContain("common practice");
  });
});

describe("inspection input problems", () => {
  it("refuses malformed or impossible dates", () => {
    expect(() => due("2024-3-15", "2024-04-01")).toThrow(/YYYY-MM-DD/);
    expect(() => due("2023-02-29", "2024-04-01")).toThrow(/not a calendar date/);
    expect(() => due("2024-13-01", "2024-04-01")).toThrow(/not a calendar date/);
  });

  it("refuses a last inspection later than today", () => {
    expect(() => due("2025-01-02", "2025-01-01")).toThrow(/later than today/);
  });
});
