import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { tokenParams } from "../../../shared/schemas/common.ts";
import { signInSchema } from "../../../shared/schemas/auth.ts";
import { signIn } from "./auth.service.ts";
import { presentSessionUser } from "./auth.presenter.ts";
import { resetRequestSchema, tokenPasswordSchema } from "../../../shared/schemas/enquiries.ts";
import * as tokens from "./tokens.service.ts";

export function authRoutes(ctx: AppContext): Router {
  const router = Router();

  router.post(
    "/sign-in",
    ...route({ allow: "anyone", body: signInSchema }, async ({ body, req, res }) => {
      const { session, user } = await signIn(ctx, body, req.ip ?? "unknown");
      res.append("Set-Cookie", ctx.auth.createSessionCookie(session.id).serialize());
      return { user: presentSessionUser(user) };
    }),
  );

  router.post(
    "/sign-out",
    ...route({ allow: "staff.enter" }, async ({ res }) => {
      // The guard let a signed-in user through, so the session is there.
      const session = res.locals.auth?.session;
      if (session) await ctx.auth.invalidateSession(session.id);
      res.append("Set-Cookie", ctx.auth.createBlankSessionCookie().serialize());
      return { ok: true };
    }),
  );

  router.post("/password-reset", ...route({ allow: "anyone", body: resetRequestSchema }, ({ body, req }) => tokens.requestReset(ctx, body.email, req.ip ?? "unknown")));

  router.post("/password-reset/confirm", ...route({ allow: "anyone", body: tokenPasswordSchema }, ({ body }) => tokens.confirmReset(ctx, body.token, body.password)));

  router.get("/invitations/:token", ...route({ allow: "anyone", params: tokenParams }, async ({ params }) => ({ invitation: await tokens.inspectInvite(ctx, params.token) })));

  router.post(
    "/invitations/accept",
    ...route({ allow: "anyone", body: tokenPasswordSchema, status: 201 }, async ({ body, res }) => {
      const session = await tokens.acceptInvite(ctx, body.token, body.password);
      res.append("Set-Cookie", ctx.auth.createSessionCookie(session.id).serialize());
      const { user } = await ctx.auth.validateSession(session.id);
      return { user: user ? presentSessionUser(user) : null };
    }),
  );

  router.get(
    "/session",
    ...route({ allow: "anyone" }, ({ user, res }) => {
      res.setHeader("Cache-Control", "no-store");
      return { user: user ? presentSessionUser(user) : null };
    }),
  );

  return router;
}
