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

// Path parameters: one schema per shape, shared by every route that has it (server/middleware/route.ts `params`).
// Digits only: coercion took "0x0b", " 11" and "1e3" for 11 and 1000. int() keeps it a safe integer.
const digits = (message: string) => z.string().regex(/^[0-9]{1,16}$/, message).transform(Number).pipe(z.number().int().positive());
const positiveId = digits("An id is written in digits only.");

/** `:id` of a record with a numeric id: a lead, a feed, a captured mail. */
export const idParams = z.object({ id: positiveId });
/** `:id` of a vehicle, and the routes under it. */
export const vehicleIdParams = idParams;
/** `:id/photos/:photoId`. */
export const photoParams = vehicleIdParams.extend({ photoId: positiveId });
/** `:id/defects/:defectId`. */
export const defectParams = vehicleIdParams.extend({ defectId: positiveId });
/** `:id` of a staff account (a generated text id). */
export const userIdParams = z.object({ id: z.string().min(1).max(255) });
/** `:slug` of a published vehicle: fixed at its first publish, lower-case letters, digits and hyphens. */
export const slugParams = z.object({ slug: z.string().regex(/^[a-z0-9-]{1,120}$/) });
/** `:slug/revisions/:number`. */
export const revisionParams = slugParams.extend({ number: positiveId });
/** `:token` of an invitation, checked by looking it up (any text is a well-formed question). */
export const tokenParams = z.object({ token: z.string() });

/** `?version=` of a delete: the version the caller last saw. */
export const versionQuery = z.object({ version: digits("The version is a whole number written in digits.") });
