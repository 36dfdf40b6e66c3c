import { Router } from "express";
import type { AppContext } from "../../lib/context.ts";
import { route } from "../../middleware/route.ts";
import { createUserSchema, updateUserSchema } from "../../../shared/schemas/users.ts";
import { userIdParams } from "../../../shared/schemas/common.ts";
import * as service from "./users.service.ts";
import * as tokens from "../auth/tokens.service.ts";
import { inviteSchema } from "../../../shared/schemas/enquiries.ts";

export function usersRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get("/", ...route({ allow: "users.manage" }, async ({ user }) => ({ users: await service.list(ctx, user) })));

  router.post("/", ...route({ allow: "users.manage", body: createUserSchema, status: 201 }, async ({ user, body }) => ({ user: await service.create(ctx, user, body) })));

  router.post("/invite", ...route({ allow: "users.manage", body: inviteSchema, status: 201 }, ({ user, body }) => tokens.invite(ctx, user, body)));

  router.patch("/:id", ...route({ allow: "users.manage", params: userIdParams, body: updateUserSchema }, async ({ user, params, body }) => ({ user: await service.update(ctx, user, params.id, body) })));

  return router;
}
