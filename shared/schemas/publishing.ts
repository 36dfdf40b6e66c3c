import { z } from "zod";

export const publishSchema = z.strictObject({
  version: z.number().int().min(1).optional(),
  overrideReason: z
    .string()
    .trim()
    .min(10, "Write the reason in a sentence: it is recorded and shown to staff.")
    .max(1000, "At most 1000 characters.")
    .optional(),
});
export type PublishBody = z.infer<typeof publishSchema>;
