import { describe, expect, it, vi } from "vitest";
import { addDays, daysBetween, localDateTimeIso, startOfDayIso, toLocalDateTimeInput } from "@/lib/dates";

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

// The shop's zone reaches every on-screen date (server and browser) through
// lib/format's default; zone offsets as above, from the IANA database via Intl.
describe("the shop's time zone (APP_TIME_ZONE)", () => {
  it("sets the default zone for on-screen times", async () => {
    vi.resetModules();
    vi.stubEnv("APP_TIME_ZONE", "America/New_York");
    try {
      const { formatDateTime, DEFAULT_TIME_ZONE } = await import("@/lib/format");
      expect(DEFAULT_TIME_ZONE).toBe("America/New_York");
      // 2026-12-01 15:30 UTC is 10:30 in New York (UTC−5 in winter), 9:30 in Chicago.
      expect(formatDateTime("2026-12-01T15:30:00Z")).toBe("Dec 1, 10:30 AM");
      expect(formatDateTime("2026-12-01T15:30:00Z", "America/Chicago")).toBe("Dec 1, 9:30 AM");
    } finally {
      vi.unstubAllEnvs();
      vi.resetModules();
    }
  });

  it("refuses a zone name Intl does not know, at start", async () => {
    vi.resetModules();
    vi.stubEnv("APP_TIME_ZONE", "Central");
    try {
      const { env } = await import("@/lib/env");
      expect(() => env()).toThrow(/APP_TIME_ZONE must be an IANA zone/);
    } finally {
      vi.unstubAllEnvs();
      vi.resetModules();
    }
  });
});

describe("localDateTimeIso / toLocalDateTimeInput: a promised-by time typed in the shop's zone", () => {
  it("reads a wall-clock time in the zone, across a daylight-saving change (common practice: US zones move in March and November)", () => {
    // 16:30 in Chicago in January is UTC−6.
    expect(localDateTimeIso("2026-01-15T16:30", "America/Chicago")).toBe("2026-01-15T22:30:00.000Z");
    // In July it is UTC−5.
    expect(localDateTimeIso("2026-07-15T16:30", "America/Chicago")).toBe("2026-07-15T21:30:00.000Z");
    expect(toLocalDateTimeInput("2026-07-15T21:30:00.000Z", "America/Chicago")).toBe("2026-07-15T16:30");
  });
  it("refuses what is not a time", () => {
    expect(localDateTimeIso("2026-02-30T10:00", "America/Chicago")).toBeNull();
    expect(localDateTimeIso("tomorrow", "America/Chicago")).toBeNull();
  });
});
