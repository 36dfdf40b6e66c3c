import { z } from "zod";
import { emailSchema } from "./common.ts";
import { ROLES } from "../constants/roles.ts";

export const signInSchema = z.strictObject({
  email: emailSchema,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(256, "That password is too long."),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const sessionUserSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;
