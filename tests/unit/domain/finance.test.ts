import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { fv, pmt } from "financial";
import {
  FINANCE_AMOUNT_MAX_CENTS,
  FINANCE_AMOUNT_MIN_CENTS,
  FINANCE_APR_MAX_PERCENT,
  FINANCE_MONTHS_MAX,
  repaymentEstimate,
} from "../../../shared/domain/finance.ts";

const amount = fc.integer({ min: FINANCE_AMOUNT_MIN_CENTS, max: FINANCE_AMOUNT_MAX_CENTS });
// Rates as quoted: 0 to 50 % in steps of 0.001 % (FINANCE_APR_DECIMALS).
const apr = fc.integer({ min: 0, max: FINANCE_APR_MAX_PERCENT * 1000 }).map((x) => x / 1000);
const months = fc.integer({ min: 1, max: FINANCE_MONTHS_MAX });

describe("repaymentEstimate: published worked examples", () => {
  it("when 10,000.00 at 8 % over 10 months, then 1,037.03 a month (SAS and Microsoft PMT examples)", () => {
    // SAS 9.x Functions and CALL Routines, "PMT Function", example: "The monthly payment for a $10,000 loan with a
    // nominal annual interest rate of 8% and 10 end-of-month payments ... PMT(0.08/12, 10, 10000) ... return a value
    // of 1037.03." https://support.sas.com/documentation/cdl/en/lefunctionsref/63354/HTML/default/n1kisp5nwkz1tpn1jarqzxto5qqb.htm
    // The same loan is Example 1 of Microsoft's PMT function page for SharePoint: rate 8 %, nper 10, pv 10000,
    // =PMT([Rate]/12, [Nper], [PV]) → -1,037.03 (sign: money paid out).
    // https://support.microsoft.com/zh-cn/sharepoint/functions-data/pmt-function
    const e = repaymentEstimate(1_000_000, 8, 10);
    expect(e?.paymentCents).toBe(103_703);
    // The settling payment and totals follow from our rounding convention (shared/domain/finance.ts), not the source.
    expect(e?.totalCents).toBe(103_703 * 9 + (e?.finalPaymentCents ?? 0));
    expect(e?.interestCents).toBe((e?.totalCents ?? 0) - 1_000_000);
  });

  it("when 21,000.00 at 6.9 % over 48 months, then 501.90 a month (Claris FileMaker PMT example)", () => {
    // Claris FileMaker Pro Help, "PMT", Example 1: "purchasing a sports car costing $21,000, at an annual rate of 6.9%
    // over 48 monthly payments. PMT(21000;.069/12;48) returns the payment amount $501.90."
    // https://help.claris.com/en/pro-help/content/pmt.html
    expect(repaymentEstimate(2_100_000, 6.9, 48)?.paymentCents).toBe(50_190);
  });

  it("when the rate is 0 %, then amount ÷ months, the last payment takes the remainder and no interest", () => {
    // issue 15 / API.md "Repayment estimate": a 0 % rate is the amount divided by the months (arithmetic, no source needed).
    expect(repaymentEstimate(1_200_000, 0, 12)).toEqual({ paymentCents: 100_000, finalPaymentCents: 100_000, totalCents: 1_200_000, interestCents: 0 });
    // 1,000.00 over 3 months: 333.33, 333.33, 333.34.
    expect(repaymentEstimate(100_000, 0, 3)).toEqual({ paymentCents: 33_333, finalPaymentCents: 33_334, totalCents: 100_000, interestCents: 0 });
  });

  it("when the rate vanishes (1e-320 %), then it is taken as quoted to 3 decimals: 0 %, never a division by zero", () => {
    expect(repaymentEstimate(100_000, 1e-320, 12)).toEqual(repaymentEstimate(100_000, 0, 12));
  });

  it("when the term is one month, then one payment of the amount plus a month's interest", () => {
    // 12 % APR → 1 % a month: 1,000.00 + 10.00 (arithmetic).
    expect(repaymentEstimate(100_000, 12, 1)).toEqual({ paymentCents: 101_000, finalPaymentCents: 101_000, totalCents: 101_000, interestCents: 1_000 });
  });

  it("when an input is outside the bounds or not whole, then null", () => {
    expect(repaymentEstimate(0, 5, 12)).toBeNull();
    expect(repaymentEstimate(-100_000, 5, 12)).toBeNull();
    expect(repaymentEstimate(FINANCE_AMOUNT_MAX_CENTS + 1, 5, 12)).toBeNull();
    expect(repaymentEstimate(100_000.5, 5, 12)).toBeNull();
    expect(repaymentEstimate(100_000, -0.1, 12)).toBeNull();
    expect(repaymentEstimate(100_000, 60, 12)).toBeNull();
    expect(repaymentEstimate(100_000, Number.NaN, 12)).toBeNull();
    expect(repaymentEstimate(100_000, 6.1234, 12)).toBeNull();
    expect(repaymentEstimate(100_000, 5, 0)).toBeNull();
    expect(repaymentEstimate(100_000, 5, 1.5)).toBeNull();
    expect(repaymentEstimate(100_000, 5, FINANCE_MONTHS_MAX + 1)).toBeNull();
  });
});

describe("repaymentEstimate: against the financial package (npm `financial`, a port of numpy-financial)", () => {
  it("when any loan in the bounds, then the level payment is PMT rounded to the cent and the last payment settles the balance", () => {
    fc.assert(
      fc.property(amount, apr, months, (p, a, n) => {
        const e = repaymentEstimate(p, a, n);
        if (!e) return false;
        const r = a / 1200;
        // pmt and fv answer with the sign of money paid out; the balance after n − 1 payments is −fv.
        const oracle = -pmt(r, n, p);
        if (Math.abs(e.paymentCents - oracle) > 0.5 + 1e-6) return false;
        const balance = -fv(r, n - 1, -e.paymentCents, p);
        return Math.abs(e.finalPaymentCents - balance * (1 + r)) <= 0.5 + 1e-6;
      }),
    );
  });
});

describe("repaymentEstimate: properties", () => {
  it("when any loan in the bounds, then total ≥ amount, the last payment is positive and total = level × (n − 1) + last", () => {
    fc.assert(
      fc.property(amount, apr, months, (p, a, n) => {
        const e = repaymentEstimate(p, a, n);
        if (!e) return false;
        return e.totalCents >= p && e.interestCents === e.totalCents - p && e.finalPaymentCents > 0 && e.totalCents === e.paymentCents * (n - 1) + e.finalPaymentCents;
      }),
    );
  });

  it("when the rate is 0 %, then the payment is amount ÷ months to the cent and the total is the amount", () => {
    fc.assert(
      fc.property(amount, months, (p, n) => {
        const e = repaymentEstimate(p, 0, n);
        return e !== null && Math.abs(e.paymentCents - p / n) <= 0.5 && e.totalCents === p && e.interestCents === 0;
      }),
    );
  });

  it("when the term grows at the same rate, then the payment does not rise", () => {
    fc.assert(
      fc.property(amount, apr, months, months, (p, a, m1, m2) => {
        const [short, long] = m1 <= m2 ? [m1, m2] : [m2, m1];
        const s = repaymentEstimate(p, a, short);
        const l = repaymentEstimate(p, a, long);
        if (!s || !l) return false;
        // Strictly lower before rounding; rounded to the cent, two terms can share a payment, never a higher one.
        return l.paymentCents <= s.paymentCents;
      }),
    );
  });

  it("when the term grows by a month, then the payment strictly falls (a worked pair)", () => {
    // 10,000.00 at 8 %: 10 months 1,037.03 (SAS, above), 11 months lower.
    expect(repaymentEstimate(1_000_000, 8, 11)?.paymentCents).toBeLessThan(103_703);
  });

  it("when the term is at its longest and the rate at its highest, then the smallest amount still settles with a positive last payment", () => {
    const e = repaymentEstimate(FINANCE_AMOUNT_MIN_CENTS, FINANCE_APR_MAX_PERCENT, FINANCE_MONTHS_MAX);
    expect(e?.finalPaymentCents).toBeGreaterThan(0);
    expect(e?.totalCents).toBeGreaterThanOrEqual(FINANCE_AMOUNT_MIN_CENTS);
  });
});
