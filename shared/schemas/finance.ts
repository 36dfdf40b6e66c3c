import { z } from "zod";
import {
  FINANCE_AMOUNT_MAX_CENTS,
  FINANCE_AMOUNT_MIN_CENTS,
  FINANCE_APR_DECIMALS,
  FINANCE_APR_MAX_PERCENT,
  FINANCE_APR_MIN_PERCENT,
  FINANCE_MONTHS_MAX,
  FINANCE_MONTHS_MIN,
  type RepaymentEstimate,
} from "../domain/finance.ts";

const money = (cents: number): string => (cents / 100).toLocaleString("en", { minimumFractionDigits: 2 });

/**
 * A query value as a decimal number written out: coercion alone would read an empty `aprPercent=` as 0 %, and
 * "1e3" or "0x10" as numbers no person typed.
 */
const decimal = (label: string, message = `${label} must be a number.`, pattern = /^-?\d+(\.\d+)?$/) =>
  z.string({ error: `${label} is required.` }).trim().regex(pattern, message).pipe(z.coerce.number());

/** `GET /api/public/finance-estimate`: the bounds are shared/domain/finance.ts's, so the route never asks it for a null. */
export const financeEstimateQuerySchema = z.strictObject({
  amountCents: decimal("The amount").pipe(
    z
      .number()
      .int("The amount must be a whole number of cents.")
      .min(FINANCE_AMOUNT_MIN_CENTS, `The amount must be at least ${money(FINANCE_AMOUNT_MIN_CENTS)}.`)
      .max(FINANCE_AMOUNT_MAX_CENTS, `The amount must be at most ${money(FINANCE_AMOUNT_MAX_CENTS)}.`),
  ),
  aprPercent: decimal(
    "The APR",
    `The APR must be a number with at most ${FINANCE_APR_DECIMALS} decimals.`,
    new RegExp(`^-?\\d+(\\.\\d{1,${FINANCE_APR_DECIMALS}})?$`),
  ).pipe(
    z
      .number()
      .min(FINANCE_APR_MIN_PERCENT, `The APR cannot be below ${FINANCE_APR_MIN_PERCENT} %.`)
      .max(FINANCE_APR_MAX_PERCENT, `The APR must be at most ${FINANCE_APR_MAX_PERCENT} %.`),
  ),
  months: decimal("The term").pipe(
    z
      .number()
      .int("The term must be a whole number of months.")
      .min(FINANCE_MONTHS_MIN, `The term must be at least ${FINANCE_MONTHS_MIN} month.`)
      .max(FINANCE_MONTHS_MAX, `The term must be at most ${FINANCE_MONTHS_MAX} months.`),
  ),
});
export type FinanceEstimateQuery = z.infer<typeof financeEstimateQuerySchema>;

/** The answer: integer cents, as shared/domain/finance.ts computes it. */
export type FinanceEstimateAnswer = RepaymentEstimate;
