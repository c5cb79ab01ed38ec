import { afterEach, describe, expect, it, vi } from "vitest";
import { startOfDayIso, toLocalDateTimeInput } from "@/lib/dates";
import { calendarDate, formatDate, formatDateTime, formatNumber, formatQuantity } from "@/lib/format";
import { formatCents } from "@/lib/money";

// Issue 13: building an Intl formatter per call was 12 % of the approval page's time.
describe("formatters are built once and reused", () => {
  afterEach(() => vi.restoreAllMocks());

  it("formats many values with no new Intl formatter after the first of each kind", () => {
    const warm = () => {
      formatQuantity(1100);
      formatNumber(12_345.67, 1);
      formatCents(124_050);
      formatDate("2026-05-04T16:30:00Z", "America/Chicago");
      formatDateTime("2026-05-04T16:30:00Z", "America/Chicago");
      calendarDate(new Date("2026-05-04T16:30:00Z"), "America/Chicago");
      startOfDayIso("2026-05-04", "America/Chicago");
      toLocalDateTimeInput("2026-05-04T16:30:00Z", "America/Chicago");
    };
    warm();
    const numbers = vi.spyOn(Intl, "NumberFormat");
    const dates = vi.spyOn(Intl, "DateTimeFormat");
    // toLocaleString builds a formatter inside the engine on every call, where a spy on Intl does not see it.
    const perCall = vi.spyOn(Number.prototype, "toLocaleString");
    for (let i = 0; i < 50; i++) warm();
    expect(numbers).not.toHaveBeenCalled();
    expect(dates).not.toHaveBeenCalled();
    expect(perCall).not.toHaveBeenCalled();
  });

  it("still formats as before", () => {
    expect(formatQuantity(1100)).toBe("1.1");
    expect(formatQuantity(2_500_125)).toBe("2,500.125");
    expect(formatNumber(12_345.67, 1)).toBe("12,345.7");
    expect(formatCents(124_050)).toBe("$1,240.50");
    expect(calendarDate(new Date("2026-05-05T03:00:00Z"), "America/Chicago")).toBe("2026-05-04");
  });
});
