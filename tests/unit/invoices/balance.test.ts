import { describe, expect, it } from "vitest";
import { afterPayment, balanceOf, dueDateOf, judgeOnlinePayment, manualPaymentProblem, paymentStateOf } from "@/lib/invoices/balance";

// Invoice status rules from the issue text (open, partly paid, paid, void);
// due date = issue date + payment terms ("net 30", common practice).
describe("balance and status follow the payments", () => {
  const inv = { status: "open" as const, totalCents: 100_000, paidCents: 0 };

  it("part payments add up to paid", () => {
    const a = afterPayment(inv, 25_000);
    expect([paymentStateOf(a), balanceOf(a)]).toEqual(["partly_paid", 75_000]);
    const b = afterPayment(a, 70_000);
    expect([paymentStateOf(b), balanceOf(b)]).toEqual(["partly_paid", 5_000]);
    const c = afterPayment(b, 5_000);
    expect([c.status, paymentStateOf(c), balanceOf(c)]).toEqual(["paid", "paid", 0]);
  });

  it("a void invoice owes nothing and reads as void", () => {
    const v = { ...inv, status: "void" as const };
    expect([paymentStateOf(v), balanceOf(v)]).toEqual(["void", 0]);
  });

  it("net 30 from Jan 15 is Feb 14; net 30 from Feb 1 2028 (leap year) is Mar 2", () => {
    expect(dueDateOf("2026-01-15", 30)).toBe("2026-02-14");
    expect(dueDateOf("2028-02-01", 30)).toBe("2028-03-02");
    expect(dueDateOf("2026-12-15", 30)).toBe("2027-01-14");
  });
});

describe("online payments must match the open balance", () => {
  const inv = { status: "open" as const, totalCents: 50_000, paidCents: 10_000 };
  it("exactly the balance is applied", () => {
    expect(judgeOnlinePayment(inv, 40_000)).toEqual({ apply: true });
  });
  it("more or less than the balance is held with a reason naming both amounts", () => {
    expect(judgeOnlinePayment(inv, 50_000)).toEqual({ apply: false, reason: "Paid $500.00 but the open balance was $400.00." });
    expect(judgeOnlinePayment(inv, 100)).toMatchObject({ apply: false });
  });
  it("a payment on a paid or void invoice is held", () => {
    expect(judgeOnlinePayment({ ...inv, paidCents: 50_000, status: "paid" }, 40_000)).toMatchObject({ apply: false });
    expect(judgeOnlinePayment({ ...inv, status: "void" }, 40_000)).toMatchObject({ apply: false });
  });
});

describe("payments the shop records by hand", () => {
  const inv = { status: "open" as const, totalCents: 50_000, paidCents: 0 };
  it("any amount up to the balance is fine", () => {
    expect(manualPaymentProblem(inv, 1)).toBeNull();
    expect(manualPaymentProblem(inv, 50_000)).toBeNull();
  });
  it("zero, more than the balance, or a void invoice is refused", () => {
    expect(manualPaymentProblem(inv, 0)).toMatch(/above zero/);
    expect(manualPaymentProblem(inv, 50_001)).toBe("$500.01 is more than the open balance of $500.00.");
    expect(manualPaymentProblem({ ...inv, status: "void" }, 100)).toMatch(/void/);
  });
});
