import { Router } from "express";
import { route } from "../../middleware/route.ts";
import { financeEstimateQuerySchema, type FinanceEstimateAnswer } from "../../../shared/schemas/finance.ts";
import { repaymentEstimate } from "../../../shared/domain/finance.ts";
import { badRequest } from "../../lib/errors.ts";

/** The repayment estimate (../shared/API.md "Repayment estimate"): pure arithmetic on the query, no database. */
export function financeRoutes(): Router {
  const router = Router();
  router.get(
    "/",
    ...route({ allow: "anyone", query: financeEstimateQuerySchema }, ({ query, res }): FinanceEstimateAnswer => {
      const estimate = repaymentEstimate(query.amountCents, query.aprPercent, query.months);
      // The schema holds the function's bounds, so this is only reached if the two drift apart.
      if (!estimate) throw badRequest("That estimate cannot be made.");
      // The answer depends on the query alone; a signed-in caller still gets no-store (server/middleware/no-store.ts).
      res.setHeader("Cache-Control", "public, max-age=3600");
      return estimate;
    }),
  );
  return router;
}
