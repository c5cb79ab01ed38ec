import { describe, expect, it } from "vitest";
import { calendarDate } from "@/lib/format";
import { localMiddayIso } from "@/lib/dates";
import { ageBalances, bucketOf, daysPastDue } from "@/lib/receivables/ageing";

// Buckets as the issue and api-v1.md name them: current, 1–30, 31–60, 61–90,
// over 90 days past due (30-day ageing bands: common practice in receivables).
// Day counts are checked against the Gregorian calendar: January has 31 days,
// February 2026 has 28, February 2028 has 29.
describe("days past due on fixed dates", () => {
  it("counts calendar days from the due date", () => {
    expect(daysPastDue("2026-01-31", "2026-01-31")).toBe(0);
    expect(daysPastDue("2026-01-31", "2026-02-01")).toBe(1);
    expect(daysPastDue("2026-01-31", "2026-03-02")).toBe(30);
    expect(daysPastDue("2028-01-31", "2028-03-02")).toBe(31);
    expect(daysPastDue("2026-03-10", "2026-03-01")).toBe(-9);
  });

  it("puts each edge in its bucket", () => {
    expect([-5, 0, 1, 30, 31, 60, 61, 90, 91, 400].map(bucketOf)).toEqual([
      "current",
      "current",
      "days1to30",
      "days1to30",
      "days31to60",
      "days31to60",
      "days61to90",
      "days61to90",
      "over90",
      "over90",
    ]);
  });

  it("today is the shop's calendar day (America/Chicago), not UTC's", () => {
    // 2026-03-02 04:30 UTC is 2026-03-01 22:30 in Chicago (UTC−6 before DST on 2026-03-08).
    const asOf = calendarDate(new Date("2026-03-02T04:30:00Z"), "America/Chicago");
    expect(asOf).toBe("2026-03-01");
    expect(daysPastDue("2026-01-31", asOf)).toBe(29);
    expect(bucketOf(daysPastDue("2026-01-31", calendarDate(new Date("2026-03-02T04:30:00Z"), "UTC")))).toBe("days1to30");
  });
});

describe("ageing a set of balances", () => {
  it("sums balances per bucket and leaves paid invoices out", () => {
    const asOf = "2026-06-30";
    const { ageing, totalDueCents, items } = ageBalances(
      [
        { id: "a", dueOn: "2026-07-15", balanceCents: 10_000 }, // not yet due
        { id: "b", dueOn: "2026-06-30", balanceCents: 1_000 }, // due today: current
        { id: "c", dueOn: "2026-06-01", balanceCents: 20_000 }, // 29 days
        { id: "d", dueOn: "2026-05-01", balanceCents: 30_000 }, // 60 days
        { id: "e", dueOn: "2026-04-01", balanceCents: 40_000 }, // 90 days
        { id: "f", dueOn: "2026-03-01", balanceCents: 50_000 }, // 121 days
        { id: "g", dueOn: "2026-01-01", balanceCents: 0 }, // paid
      ],
      asOf,
    );
    expect(ageing).toEqual({ current: 11_000, days1to30: 20_000, days31to60: 30_000, days61to90: 40_000, over90: 50_000 });
    expect(totalDueCents).toBe(151_000);
    expect(items.map((i) => [i.id, i.daysPastDue])).toEqual([
      ["f", 121],
      ["e", 90],
      ["d", 60],
      ["c", 29],
      ["b", 0],
      ["a", -15],
    ]);
  });
});

describe("a payment dated by hand lands on its day in the shop's zone", () => {
  it("noon in Chicago is 18:00 UTC in winter and 17:00 UTC in summer (IANA tz database via Intl)", () => {
    expect(localMiddayIso("2026-01-15", "America/Chicago")).toBe("2026-01-15T18:00:00.000Z");
    expect(localMiddayIso("2026-07-15", "America/Chicago")).toBe("2026-07-15T17:00:00.000Z");
    expect(localMiddayIso("2026-07-15", "Asia/Tokyo")).toBe("2026-07-15T03:00:00.000Z");
    expect(calendarDate(new Date(localMiddayIso("2026-03-08", "America/Chicago")), "America/Chicago")).toBe("2026-03-08");
  });
});
