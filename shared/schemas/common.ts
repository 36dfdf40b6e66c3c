import { z } from "zod";

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .max(254, "An e-mail address is at most 254 characters.")
  .pipe(z.email({ error: "Enter a valid e-mail address, like name@example.com." }));

/** Length is the only composition rule (NIST SP 800-63B); the server also refuses common passwords. */
export const newPasswordSchema = z
  .string({ error: "Enter a password." })
  .min(12, "Use at least 12 characters. A few unrelated words make a strong, memorable password.")
  .max(256, "Use at most 256 characters.");

export const versionSchema = z.number({ error: "The record's version is missing." }).int().min(1);

export const idParamSchema = z.object({ id: z.string().min(1).max(255) });
export const numericIdParamSchema = z.object({ id: z.coerce.number().int().positive() });

/** `:id` of a vehicle (and of any record with a numeric id) in a path. */
export const vehicleIdParams = numericIdParamSchema;
