import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { currentUser, requireRole } from "../../middleware/authenticate.ts";
import { validate } from "../../middleware/validate.ts";
import { createUserSchema, updateUserSchema, type CreateUserInput, type UpdateUserInput } from "../../../shared/schemas/users.ts";
import { idParamSchema } from "../../../shared/schemas/common.ts";
import * as service from "./users.service.ts";
import * as tokens from "../auth/tokens.service.ts";
import { inviteSchema } from "../../../shared/schemas/enquiries.ts";

export function usersRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(requireRole("admin"));

  router.get("/", async (_req, res) => {
    res.json({ users: await service.list(ctx, currentUser(res.locals)) });
  });

  router.post("/", validate("body", createUserSchema), async (_req, res) => {
    const user = await service.create(ctx, currentUser(res.locals), res.locals.body as CreateUserInput);
    res.status(201).json({ user });
  });

  router.post("/invite", validate("body", inviteSchema), async (_req, res) => {
    res.status(201).json(await tokens.invite(ctx, currentUser(res.locals), res.locals.body as never));
  });

  router.patch("/:id", validate("params", idParamSchema), validate("body", updateUserSchema), async (_req, res) => {
    const { id } = res.locals.params as { id: string };
    const user = await service.update(ctx, currentUser(res.locals), id, res.locals.body as UpdateUserInput);
    res.json({ user });
  });

  return router;
}
