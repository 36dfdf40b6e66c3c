import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { requireStaff } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { signInSchema, type SignInInput } from "../../../shared/schemas/auth.ts";
import { signIn } from "./auth.service.ts";
import { presentSessionUser } from "../users/users.presenter.ts";
import { resetRequestSchema, tokenPasswordSchema } from "../../../shared/schemas/enquiries.ts";
import * as tokens from "./tokens.service.ts";

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

  router.post("/password-reset", validate("body", resetRequestSchema), async (req, res) => {
    res.json(await tokens.requestReset(ctx, (res.locals.body as { email: string }).email, req.ip ?? "unknown"));
  });

  router.post("/password-reset/confirm", validate("body", tokenPasswordSchema), async (_req, res) => {
    const { token, password } = res.locals.body as { token: string; password: string };
    res.json(await tokens.confirmReset(ctx, token, password));
  });

  router.get("/invitations/:token", async (req, res) => {
    res.json({ invitation: await tokens.inspectInvite(ctx, String(req.params.token)) });
  });

  router.post("/invitations/accept", validate("body", tokenPasswordSchema), async (_req, res) => {
    const { token, password } = res.locals.body as { token: string; password: string };
    const session = await tokens.acceptInvite(ctx, token, password);
    res.append("Set-Cookie", ctx.auth.createSessionCookie(session.id).serialize());
    const { user } = await ctx.auth.validateSession(session.id);
    res.status(201).json({ user: user ? presentSessionUser(user) : null });
  });

  router.get("/session", (_req, res) => {
    res.setHeader("Cache-Control", "no-store");
    const auth = res.locals.auth;
    res.json({ user: auth ? presentSessionUser(auth.user) : null });
  });

  return router;
}
