import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { requireStaff } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { signInSchema, type SignInInput } from "../../../shared/schemas/auth.ts";
import { signIn } from "./auth.service.ts";
import { presentSessionUser } from "../users/users.presenter.ts";

export function authRoutes(ctx: AppContext): Router {
  const router = Router();

  router.post("/sign-in", validate("body", signInSchema), async (req, res) => {
    const { session, user } = await signIn(ctx, res.locals.body as SignInInput, req.ip ?? "unknown");
    res.append("Set-Cookie", ctx.auth.createSessionCookie(session.id).serialize());
    res.json({ user: presentSessionUser(user) });
  });

  router.post("/sign-out", requireStaff, async (_req, res) => {
    await ctx.auth.invalidateSession(res.locals.auth!.session.id);
    res.append("Set-Cookie", ctx.auth.createBlankSessionCookie().serialize());
    res.json({ ok: true });
  });

  router.get("/session", (_req, res) => {
    res.setHeader("Cache-Control", "no-store");
    const auth = res.locals.auth;
    res.json({ user: auth ? presentSessionUser(auth.user) : null });
  });

  return router;
}
