import { z } from "zod";
import { ROLES } from "../constants/roles.ts";
import { emailSchema, newPasswordSchema, versionSchema } from "./common.ts";

const nameSchema = z
  .string({ error: "Enter the person's name." })
  .trim()
  .min(1, "Enter the person's name.")
  .max(120, "A name is at most 120 characters.");
const roleSchema = z.enum(ROLES, { error: "Choose a role: admin, sales, workshop or marketing." });

export const createUserSchema = z.strictObject({
  email: emailSchema,
  name: nameSchema,
  role: roleSchema,
  password: newPasswordSchema,
});
export type CreateUserInput = z.infer<typeof createUserSchema>;

export const updateUserSchema = z
  .strictObject({
    version: versionSchema,
    name: nameSchema.optional(),
    role: roleSchema.optional(),
    active: z.boolean({ error: "Active must be true or false." }).optional(),
    password: newPasswordSchema.optional(),
  })
  .refine((v) => Object.keys(v).length > 1, { message: "Change at least one field.", path: ["_"] });
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export interface UserView {
  id: string;
  email: string;
  name: string;
  role: (typeof ROLES)[number];
  active: boolean;
  lastSignInAt: string | null;
  createdAt: string;
  version: number;
}
