import { describe, expect, it } from "vitest";
import { addDays, daysBetween, startOfDayIso } from "@/lib/dates";

// Offsets from the IANA time zone database via Intl (ECMA-402): US Central is
// UTC−6 in winter and UTC−5 in summer; daylight saving began 2026-03-08.
describe("calendar days in a time zone", () => {
  it("midnight in Chicago is 06:00 UTC in winter and 05:00 UTC in summer", () => {
    expect(startOfDayIso("2026-01-01", "America/Chicago")).toBe("2026-01-01T06:00:00.000Z");
    expect(startOfDayIso("2026-07-01", "America/Chicago")).toBe("2026-07-01T05:00:00.000Z");
  });
  it("handles the day daylight saving starts", () => {
    expect(startOfDayIso("2026-03-08", "America/Chicago")).toBe("2026-03-08T06:00:00.000Z");
    expect(startOfDayIso("2026-03-09", "America/Chicago")).toBe("2026-03-09T05:00:00.000Z");
  });
  it("is plain UTC midnight in UTC", () => {
    expect(startOfDayIso("2026-12-01", "UTC")).toBe("2026-12-01T00:00:00.000Z");
  });
  it("adds days across month and leap-year ends", () => {
    expect(addDays("2028-02-28", 1)).toBe("2028-02-29");
    expect(addDays("2026-12-31", 30)).toBe("2027-01-30");
    expect(daysBetween("2026-11-01", "2026-12-01")).toBe(30);
  });
});
