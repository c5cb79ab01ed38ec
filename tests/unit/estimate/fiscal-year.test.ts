import { describe, expect, it } from "vitest";
import { fiscalYearOf, isInFiscalYear } from "@/lib/estimate";

// Calendar facts: Gregorian leap years (divisible by 4, except centuries not
// divisible by 400). Fiscal years here run from the 1st of the start month.

describe("fiscalYearOf, start month 1 (calendar year)", () => {
  it("first day", () => {
    expect(fiscalYearOf("2026-01-01", 1)).toEqual({
      startDate: "2026-01-01",
      endDate: "2026-12-31",
      label: "FY 2026",
      startYear: 2026,
    });
  });

  it("last day", () => {
    expect(fiscalYearOf("2026-12-31", 1).startDate).toBe("2026-01-01");
    expect(fiscalYearOf("2026-12-31", 1).endDate).toBe("2026-12-31");
  });
});

describe("fiscalYearOf, start month 7 (July to June)", () => {
  it("2026-12-01 is in FY 2026–27, running 2026-07-01 to 2027-06-30 (the brief's example)", () => {
    expect(fiscalYearOf("2026-12-01", 7)).toEqual({
      startDate: "2026-07-01",
      endDate: "2027-06-30",
      label: "FY 2026–27",
      startYear: 2026,
    });
  });

  it("first day 2026-07-01 opens FY 2026–27", () => {
    expect(fiscalYearOf("2026-07-01", 7).label).toBe("FY 2026–27");
  });

  it("the day before, 2026-06-30, is the last day of FY 2025–26", () => {
    const fy = fiscalYearOf("2026-06-30", 7);
    expect(fy).toMatchObject({ startDate: "2025-07-01", endDate: "2026-06-30", label: "FY 2025–26" });
  });

  it("last day 2027-06-30 still belongs to FY 2026–27", () => {
    expect(fiscalYearOf("2027-06-30", 7).label).toBe("FY 2026–27");
  });

  it("takes the date part of an ISO timestamp", () => {
    expect(fiscalYearOf("2027-06-30T23:59:59Z", 7).label).toBe("FY 2026–27");
  });
});

describe("other start months", () => {
  it("October start, as the US federal fiscal year (31 U.S.C. 1102: begins October 1)", () => {
    expect(fiscalYearOf("2026-09-30", 10)).toMatchObject({ startDate: "2025-10-01", endDate: "2026-09-30" });
    expect(fiscalYearOf("2026-10-01", 10)).toMatchObject({ startDate: "2026-10-01", endDate: "2027-09-30" });
  });

  it("March start ends on 29 February in a leap year and 28 February otherwise", () => {
    expect(fiscalYearOf("2023-03-01", 3).endDate).toBe("2024-02-29");
    expect(fiscalYearOf("2024-02-29", 3).startDate).toBe("2023-03-01");
    expect(fiscalYearOf("2024-03-01", 3).endDate).toBe("2025-02-28");
    // 2100 is not a leap year (century not divisible by 400)
    expect(fiscalYearOf("2099-03-01", 3)).toMatchObject({ endDate: "2100-02-28", label: "FY 2099–2100" });
  });
});

describe("isInFiscalYear and bad input", () => {
  it("both ends are inside, the days beyond are not", () => {
    const fy = fiscalYearOf("2026-12-01", 7);
    expect(isInFiscalYear("2026-07-01", fy)).toBe(true);
    expect(isInFiscalYear("2027-06-30T12:00:00Z", fy)).toBe(true);
    expect(isInFiscalYear("2026-06-30", fy)).toBe(false);
    expect(isInFiscalYear("2027-07-01", fy)).toBe(false);
  });

  it("refuses impossible dates and start months", () => {
    expect(() => fiscalYearOf("2026-02-29", 7)).toThrow(RangeError);
    expect(() => fiscalYearOf("12/01/2026", 7)).toThrow(RangeError);
    expect(() => fiscalYearOf("2026-12-01", 0)).toThrow(RangeError);
    expect(() => fiscalYearOf("2026-12-01", 13)).toThrow(RangeError);
  });
});
