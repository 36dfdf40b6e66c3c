/**
 * The repayment estimate of the condition page (issue 15): the level monthly repayment of an amortising loan by the
 * standard annuity formula, payment = P·r / (1 − (1 + r)^−n) with r = APR ÷ 12 (a nominal APR, as spreadsheet PMT
 * functions take it), and P ÷ n when the rate is 0 %. An estimate, not an offer of credit: lenders decide the rate.
 *
 * Money is integer cents in and out. Rounding, decided once here:
 * - the level payment is rounded to the nearest cent (half up), so it matches the published PMT examples;
 * - the last payment settles the loan: it is what is left after the level payments, grown by one month's interest,
 *   rounded to the cent. It differs from the level payment by the rounding carried over the term (a few cents;
 *   at 0 % exactly the remainder of amount ÷ months), as on a lender's schedule;
 * - total = level payment × (months − 1) + last payment; interest = total − amount.
 * Rounding every payment with no settling payment (total = payment × months) would show a 0 % loan of 10.00 over
 * 3 months as 3 × 3.33 = 9.99, a negative interest of a cent; this way a 0 % loan's interest is exactly 0 and, at
 * any rate, total ≥ amount.
 *
 * Inside the bounds below the last payment is always positive: the carried rounding (at most half a cent a month,
 * compounded over the term) stays below the smallest level payment the bounds allow.
 */

/** The smallest amount estimated: 500.00 (below it the estimate is meaningless for a vehicle and the settling payment could be ≤ 0 at the highest rate and term). */
export const FINANCE_AMOUNT_MIN_CENTS = 50_000;
/** The largest amount estimated: 10,000,000.00. */
export const FINANCE_AMOUNT_MAX_CENTS = 1_000_000_000;
/** APR in percent, 0 to 50 inclusive (a nominal yearly rate, e.g. 6.9). */
export const FINANCE_APR_MIN_PERCENT = 0;
export const FINANCE_APR_MAX_PERCENT = 50;
/**
 * At most three decimals (6.125 %), as rates are quoted: it also keeps the smallest rate above 0 at 0.001 %, far from
 * the vanishing rates (1e-320 %) where 1 + r rounds to 1 in floating point and the formula divides by zero.
 */
export const FINANCE_APR_DECIMALS = 3;
/** Whole months, 1 to 120 (ten years). */
export const FINANCE_MONTHS_MIN = 1;
export const FINANCE_MONTHS_MAX = 120;

export interface RepaymentEstimate {
  /** The level monthly payment, every month but the last. */
  paymentCents: number;
  /** The last payment, which settles the loan (equal to paymentCents when the rounding comes out even, and for one month). */
  finalPaymentCents: number;
  /** Everything paid: paymentCents × (months − 1) + finalPaymentCents. */
  totalCents: number;
  /** totalCents − amountCents; 0 at 0 %. */
  interestCents: number;
}

const inRange = (x: number, min: number, max: number): boolean => Number.isFinite(x) && x >= min && x <= max;

const APR_SCALE = 10 ** FINANCE_APR_DECIMALS;
const hasAprDecimals = (apr: number): boolean => Math.abs(apr * APR_SCALE - Math.round(apr * APR_SCALE)) < 1e-6;

/** Half up to a whole cent; every value rounded here is positive. */
const toCent = (x: number): number => Math.round(x);

/**
 * The estimate for a loan of `amountCents` at `aprPercent` (nominal, yearly) over `months` monthly payments in arrears,
 * or null when an input is outside the exported bounds (not a whole number of cents or months, an APR with more than
 * FINANCE_APR_DECIMALS decimals, not finite).
 */
export function repaymentEstimate(amountCents: number, aprPercent: number, months: number): RepaymentEstimate | null {
  if (!Number.isInteger(amountCents) || !inRange(amountCents, FINANCE_AMOUNT_MIN_CENTS, FINANCE_AMOUNT_MAX_CENTS)) return null;
  if (!inRange(aprPercent, FINANCE_APR_MIN_PERCENT, FINANCE_APR_MAX_PERCENT) || !hasAprDecimals(aprPercent)) return null;
  if (!Number.isInteger(months) || !inRange(months, FINANCE_MONTHS_MIN, FINANCE_MONTHS_MAX)) return null;

  // The rate as quoted (to its decimals), so a vanishing rate is 0 % and never 1 + r === 1 with r > 0.
  const r = Math.round(aprPercent * APR_SCALE) / APR_SCALE / 100 / 12;
  if (r === 0) {
    // Integer arithmetic: the level payment is the rounded share, the last takes the remainder.
    const payment = toCent(amountCents / months);
    return settled(amountCents, months, payment, amountCents - payment * (months - 1));
  }
  // (1 + r)^k − 1 through expm1/log1p: it keeps its digits when r is small, where 1 − (1 + r)^−n would cancel.
  const payment = toCent((amountCents * r) / -Math.expm1(-months * Math.log1p(r)));
  // Balance after months − 1 level payments: P·g − p·(g − 1)/r with g = (1 + r)^(months − 1); the last payment is
  // that balance plus its month of interest.
  const gMinus1 = Math.expm1((months - 1) * Math.log1p(r));
  const balance = amountCents * (1 + gMinus1) - (payment * gMinus1) / r;
  return settled(amountCents, months, payment, toCent(balance * (1 + r)));
}

function settled(amountCents: number, months: number, payment: number, last: number): RepaymentEstimate {
  const totalCents = payment * (months - 1) + last;
  return { paymentCents: payment, finalPaymentCents: last, totalCents, interestCents: totalCents - amountCents };
}
