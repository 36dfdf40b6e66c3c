import { describe, expect, it } from "vitest";
import { zodResolver } from "@hookform/resolvers/zod";
import type { FieldError, FieldErrors } from "react-hook-form";
import { signInSchema } from "../../shared/schemas/auth.ts";
import { enquirySchema } from "../../shared/schemas/enquiries.ts";
import { dealershipSettingsSchema } from "../../shared/schemas/dealership.ts";
import { zodFields } from "../../shared/schemas/fields.ts";

// The forms check with @hookform/resolvers' zod resolver on the shared schemas; the server answers with zodFields().
// Both must give the person the same message on the same field, with the zod 4 we pin.
const options = { fields: {}, shouldUseNativeValidation: false } as const;
const run = (schema: Parameters<typeof zodResolver>[0], values: Record<string, unknown>) => zodResolver(schema)(values, undefined, options);

/** RHF's nested errors flattened to zodFields' dotted keys. */
function flat(errors: FieldErrors, prefix = ""): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(errors)) {
    if (!v || typeof v !== "object") continue;
    const key = prefix ? `${prefix}.${k}` : k;
    if (typeof (v as FieldError).message === "string") out[key] = (v as FieldError).message!;
    else Object.assign(out, flat(v as FieldErrors, key));
  }
  return out;
}

describe("the zod resolver on the shared schemas (zod 4)", () => {
  it("when sign-in is sent empty, then each field carries the message the server would give", async () => {
    const values = { email: "", password: "" };
    const result = await run(signInSchema, values);
    const server = zodFields(signInSchema.safeParse(values).error!);
    expect(flat(result.errors)).toEqual(server);
    expect(server.email).toMatch(/valid e-mail/);
    expect(server.password).toBe("Enter your password.");
  });

  it("when the values pass, then the handler receives the schema's output (trimmed, lower-cased), not the raw input", async () => {
    const result = await run(signInSchema, { email: "  Sales@Demo.TEST ", password: "x" });
    expect(result.errors).toEqual({});
    expect(result.values).toEqual({ email: "sales@demo.test", password: "x" });
  });

  it("when an enquiry has nested and cross-field problems, then the paths match zodFields, refinements included", async () => {
    const values = { name: "", email: "", phone: "", message: "", preferredContact: "either", tradeIn: { make: "", model: "", year: 1900, odometerKm: null }, consent: false, website: "", startedAt: 1 };
    const result = await run(enquirySchema, values);
    const server = zodFields(enquirySchema.safeParse(values).error!);
    expect(flat(result.errors)).toEqual(server);
    expect(server["tradeIn.year"]).toBe("From 1950.");
    expect(server.phone).toMatch(/e-mail address or a phone number/);
  });

  it("when a number is out of range, then the settings message is the schema's own", async () => {
    const values = { version: 1, legalMinTreadMm: 9 };
    const result = await run(dealershipSettingsSchema, values);
    expect(flat(result.errors)).toEqual({ legalMinTreadMm: "At most 5 mm." });
  });
});
