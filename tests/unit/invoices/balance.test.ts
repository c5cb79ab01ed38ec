import { describe, expect, it } from "vitest";
import { afterCredit, afterPayment, balanceOf, creditProblem, dueDateOf, judgeOnlinePayment, manualPaymentProblem, paymentStateOf } from "@/lib/invoices/balance";

// Invoice status rules from the issue text (open, partly paid, paid, void);
// due date = issue date + payment terms ("net 30", common practice).
describe("balance and status follow the payments", () => {
  const inv = { status: "open" as const, totalCents: 100_000, paidCents: 0, creditedCents: 0 };

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
  const inv = { status: "open" as const, totalCents: 50_000, paidCents: 10_000, creditedCents: 0 };
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
  const inv = { status: "open" as const, totalCents: 50_000, paidCents: 0, creditedCents: 0 };
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

// A credit note lowers what is owed, never past it (a refund is settled outside
// the app): the open balance is total − payments − credits (common practice).
describe("credit notes", () => {
  const inv = { status: "open" as const, totalCents: 100_000, paidCents: 60_000, creditedCents: 0 };

  it("lower the balance and can settle an invoice together with payments", () => {
    // $1,000.00 − $600.00 paid − $150.00 credited = $250.00 owed.
    const a = afterCredit(inv, 15_000);
    expect([a.status, paymentStateOf(a), balanceOf(a)]).toEqual(["open", "partly_paid", 25_000]);
    const b = afterPayment(a, 25_000);
    expect([b.status, paymentStateOf(b), balanceOf(b)]).toEqual(["paid", "paid", 0]);
    // A credit for the whole remainder settles it too.
    expect(afterCredit(inv, 40_000)).toMatchObject({ status: "paid", creditedCents: 40_000 });
  });

  it("are refused above the open balance, at zero, on a paid or a void invoice", () => {
    expect(creditProblem(inv, 40_000)).toBeNull();
    expect(creditProblem(inv, 40_001)).toBe("A $400.01 credit is more than the open balance of $400.00; a credit can only lower what is owed.");
    expect(creditProblem(inv, 0)).toBe("Enter a credit above zero.");
    expect(creditProblem({ ...inv, paidCents: 100_000, status: "paid" }, 100)).toMatch(/paid in full/);
    expect(creditProblem({ ...inv, status: "void" }, 100)).toMatch(/void/);
  });

  it("count in what an online payment must match", () => {
    expect(judgeOnlinePayment({ ...inv, creditedCents: 15_000 }, 25_000)).toEqual({ apply: true });
    expect(manualPaymentProblem({ ...inv, creditedCents: 15_000 }, 25_001)).toBe("$250.01 is more than the open balance of $250.00.");
  });
});
