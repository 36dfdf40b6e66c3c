import { z } from "zod";
import { CONTACT_PREFERENCES, LEAD_STATUSES } from "../constants/leads.ts";
import { emailSchema, versionSchema } from "./common.ts";

const optionalText = (max: number, label: string) => z.string().trim().max(max, `${label} is at most ${max} characters.`).optional().default("");

/** A buyer's enquiry from the condition page. At least one of e-mail and phone; consent is required. */
export const enquirySchema = z
  .strictObject({
    name: z.string({ error: "Tell us your name." }).trim().min(1, "Tell us your name.").max(120, "At most 120 characters."),
    email: z.union([z.literal(""), emailSchema]).optional().default(""),
    phone: z
      .string()
      .trim()
      .max(40, "At most 40 characters.")
      .regex(/^[0-9+()\-\s]*$/, "Use digits, spaces and + ( ) - only.")
      .optional()
      .default(""),
    message: z.string({ error: "Write your question." }).trim().min(1, "Write your question or what you would like to know.").max(4000, "At most 4000 characters."),
    preferredContact: z.enum(CONTACT_PREFERENCES, { error: "Choose how we should contact you." }).default("either"),
    tradeIn: z
      .strictObject({
        make: optionalText(60, "The make"),
        model: optionalText(60, "The model"),
        year: z.number().int().min(1950, "From 1950.").max(2100).nullable().optional(),
        odometerKm: z.number().int().min(0).max(2_000_000).nullable().optional(),
      })
      .nullable()
      .optional(),
    consent: z.literal(true, { error: "Tick the box so we may contact you about this vehicle." }),
    /** Honeypot: people never see this field, so it stays empty. */
    website: z.string().max(200).optional().default(""),
    /** When the form was shown (ms since epoch), for the minimum fill time. */
    startedAt: z.number().int().positive(),
    revision: z.number().int().positive().optional(),
  })
  .superRefine(
    (v, ctx) => {
    if (!v.email && !v.phone) {
      ctx.addIssue({ code: "custom", path: ["email"], message: "Give an e-mail address or a phone number so we can reply." });
      ctx.addIssue({ code: "custom", path: ["phone"], message: "Give an e-mail address or a phone number so we can reply." });
    }
    if (v.preferredContact === "email" && !v.email) ctx.addIssue({ code: "custom", path: ["email"], message: "You asked for e-mail: give the address." });
    if (v.preferredContact === "phone" && !v.phone) ctx.addIssue({ code: "custom", path: ["phone"], message: "You asked for a call: give the number." });
    },
    // Run even when other fields failed, so the buyer sees every problem at once.
    { when: (payload) => typeof payload.value === "object" && payload.value !== null },
  );
export type EnquiryInput = z.infer<typeof enquirySchema>;

export const leadListQuerySchema = z.strictObject({
  status: z
    .union([z.string(), z.array(z.string())])
    .transform((v) => (Array.isArray(v) ? v : v.split(",")).filter(Boolean))
    .pipe(z.array(z.enum(LEAD_STATUSES)))
    .optional(),
  assignee: z.string().max(255).optional(),
  vehicleId: z.coerce.number().int().positive().optional(),
  q: z.string().trim().max(80).optional(),
  due: z.enum(["overdue", "today"]).optional(),
  page: z.coerce.number().int().min(1).max(10_000).optional(),
});
export type LeadListQuery = z.infer<typeof leadListQuerySchema>;

export const updateLeadSchema = z.strictObject({
  version: versionSchema,
  status: z.enum(LEAD_STATUSES, { error: "Choose a status from the list." }).optional(),
  assigneeId: z.string().max(255).nullable().optional(),
  followUpOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "A date like 2026-12-03.").nullable().optional(),
  note: z.string().trim().min(1).max(4000).optional(),
});
export type UpdateLeadInput = z.infer<typeof updateLeadSchema>;

export const leadMessageSchema = z.strictObject({
  body: z.string().trim().min(1, "Write the message.").max(8000, "At most 8000 characters."),
});

export const shareVehicleSchema = z.strictObject({
  email: emailSchema,
  name: z.string().trim().max(120).optional().default(""),
  message: z.string().trim().max(2000, "At most 2000 characters.").optional().default(""),
});

export const inviteSchema = z.strictObject({
  email: emailSchema,
  name: z.string().trim().min(1, "Enter the person's name.").max(120),
  role: z.enum(["admin", "sales", "workshop", "marketing"], { error: "Choose a role." }),
});

export const tokenPasswordSchema = z.strictObject({
  token: z.string().min(20).max(200),
  password: z.string().min(12, "Use at least 12 characters.").max(256, "Use at most 256 characters."),
});

export const resetRequestSchema = z.strictObject({ email: emailSchema });
