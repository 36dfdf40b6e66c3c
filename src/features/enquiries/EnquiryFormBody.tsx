import { useEffect, useId, useRef, useState } from "react";
import { useForm, useWatch, type FieldErrors, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useSubmitEnquiry } from "./api.ts";
import { isApiError } from "../../lib/api-client.ts";
import { CheckboxField, TextAreaField, TextField } from "../../components/form/Field.tsx";
import { flatErrors, setServerErrors } from "../../components/form/use-zod-form.ts";
import { Button } from "../../components/ui/Button.tsx";
import { Notice } from "../../components/feedback/Notice.tsx";
import { enquirySchema, type EnquiryInput } from "../../../shared/schemas/enquiries.ts";
import { CONTACT_LABELS, CONTACT_PREFERENCES } from "../../../shared/constants/leads.ts";
import type { EnquiryFormProps } from "./EnquiryForm.tsx";

type Preference = (typeof CONTACT_PREFERENCES)[number];

const blank = {
  name: "",
  email: "",
  phone: "",
  message: "",
  preferredContact: "either" as Preference,
  tradeIn: { make: "", model: "", year: "", odometerKm: "" },
  consent: false,
  website: "",
  // Not inputs, but what the body needs beside them: the trade-in part open or closed, when the form was shown
  // (the server refuses answers faster than a person types) and the revision being read.
  tradeInOpen: false,
  startedAt: 0,
  revision: 0,
};
type Values = typeof blank;

const CONTACT_HINTS: Record<Preference, string> = { email: "We write to you.", phone: "We call you.", either: "Whichever reaches you first." };

/** A whole number typed by a person: spaces, commas and points between thousands are allowed. */
const wholeNumber = (s: string) => {
  const t = s.replace(/[\s,.\u202f']/g, "");
  return /^\d+$/.test(t) ? Number(t) : null;
};

/** Values as typed (strings) → the request body, with the checks a number field needs before zod sees it. */
function toBody(v: Values) {
  const pre: Record<string, string> = {};
  let tradeIn = null as null | { make: string; model: string; year: number | null; odometerKm: number | null };
  const t = v.tradeIn;
  if (v.tradeInOpen && (t.make.trim() || t.model.trim() || t.year.trim() || t.odometerKm.trim())) {
    const year = t.year.trim() ? wholeNumber(t.year) : null;
    const km = t.odometerKm.trim() ? wholeNumber(t.odometerKm) : null;
    if (t.year.trim() && year === null) pre["tradeIn.year"] = "Write the year in figures, like 2014.";
    if (t.odometerKm.trim() && km === null) pre["tradeIn.odometerKm"] = "Write the distance in whole kilometres, like 150000.";
    if (!t.make.trim() && !t.model.trim()) pre["tradeIn.make"] = "Tell us at least the make or the model, or close this part.";
    tradeIn = { make: t.make, model: t.model, year, odometerKm: km };
  }
  const body = {
    name: v.name,
    email: v.email,
    phone: v.phone,
    message: v.message,
    preferredContact: v.preferredContact,
    tradeIn,
    consent: v.consent,
    website: v.website,
    startedAt: v.startedAt || Date.now(),
    revision: v.revision,
  };
  return { body, pre };
}

/** Friendlier words for zod's own messages on the trade-in numbers. */
const FIELD_FALLBACK: Record<string, string> = {
  "tradeIn.year": "Give a year between 1950 and 2100.",
  "tradeIn.odometerKm": "Give a distance between 0 and 2,000,000 km.",
};

const check = zodResolver(enquirySchema);

/**
 * The schema's check of the body, with the number checks made before it (they win over zod's wording). The paths
 * of both name the inputs: `tradeIn.year` is the year's input.
 */
const enquiryResolver: Resolver<Values, unknown, EnquiryInput> = async (values, ctx, options) => {
  const { body, pre } = toBody(values);
  const result = await check(body as never, ctx, options as never);
  if (!Object.keys(pre).length) return result;
  const errors: FieldErrors<Values> = { ...result.errors };
  for (const [path, message] of Object.entries(pre)) {
    const [head, leaf] = path.split(".") as ["tradeIn", keyof Values["tradeIn"]];
    errors[head] = { ...(errors[head] ?? {}), [leaf]: { type: "custom", message } };
  }
  return { values: {}, errors };
};

/**
 * The buyer's question about one vehicle, phone first. Every problem is shown at once, before and after sending;
 * what was typed is never cleared by an error. Public bundle: imports only shared/, src/lib and src/components.
 */
export default function EnquiryFormBody({ slug, revision, vehicleTitle, stockNumber, dealership }: EnquiryFormProps) {
  const uid = useId();
  const submit = useSubmitEnquiry(slug);
  const [sentNext, setSentNext] = useState<string | null>(null);
  const form = useForm<Values, unknown, EnquiryInput>({
    defaultValues: { ...blank, revision },
    resolver: enquiryResolver,
    // Checked on send only; the buyer's corrections clear their own field (below).
    mode: "onSubmit",
    reValidateMode: "onSubmit",
    shouldFocusError: false,
  });
  const tradeInOpen = useWatch({ control: form.control, name: "tradeInOpen" });
  const formRef = useRef<HTMLFormElement>(null);
  const thanksRef = useRef<HTMLDivElement>(null);
  const [focusTick, setFocusTick] = useState(0);

  // When the form is shown: the server refuses answers faster than a person types.
  useEffect(() => {
    form.setValue("startedAt", Date.now());
  }, [form]);

  // After a failed send, put the keyboard on the first field that needs attention.
  useEffect(() => {
    if (!focusTick) return;
    formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
  }, [focusTick]);

  useEffect(() => {
    if (sentNext) thanksRef.current?.focus();
  }, [sentNext]);

  const error = submit.error;
  const serverFields = isApiError(error) && error.status === 400 ? error.fields : {};
  const fields = flatErrors(form.formState.errors);
  const msg = (key: string) => (fields[key] ? (fields[key].startsWith("Invalid input") || fields[key].startsWith("Too ") ? FIELD_FALLBACK[key] ?? fields[key] : fields[key]) : undefined);
  const count = Object.keys(fields).length;

  // A field the buyer has just corrected stops shouting; the rest stay until the next send.
  const field = (name: Parameters<typeof form.register>[0]) =>
    form.register(name, { onChange: () => form.clearErrors(name === "email" || name === "phone" ? ["email", "phone"] : name) });

  const onSubmit = form.handleSubmit(
    (body) =>
      submit.mutate(body, {
        onSuccess: (res) => setSentNext(res.next),
        onError: (e) => {
          if (isApiError(e) && e.status === 400) setServerErrors(form, e);
          setFocusTick((n) => n + 1);
        },
      }),
    () => {
      submit.reset();
      setFocusTick((n) => n + 1);
    },
  );

  function another() {
    // Keep who they are; a new question starts empty and needs the buyer's consent again.
    const v = form.getValues();
    form.reset({ ...blank, revision, startedAt: Date.now(), name: v.name, email: v.email, phone: v.phone, preferredContact: v.preferredContact });
    submit.reset();
    setSentNext(null);
  }

  const name = form.getValues("name");
  if (sentNext !== null)
    return (
      <div ref={thanksRef} tabIndex={-1} className="rounded-lg border border-signal bg-signal-wash px-5 py-6 outline-none" role="status" aria-live="polite">
        <h3 className="text-xl font-bold">Thank you{name.trim() ? `, ${name.trim().split(/\s+/)[0]}` : ""}. Your question is with us.</h3>
        <p className="mt-2">
          About the <strong>{vehicleTitle}</strong> <span className="text-ink-soft">(stock number <span className="font-mono">{stockNumber}</span>)</span>.
        </p>
        <p className="mt-3">{sentNext}</p>
        <p className="mt-3 text-sm text-ink-soft">
          In a hurry? Call {dealership.name} on{" "}
          <a href={`tel:${dealership.phone.replace(/[^\d+]/g, "")}`} className="font-bold">
            {dealership.phone}
          </a>
          .
        </p>
        <p className="mt-4">
          <button type="button" onClick={another} className="min-h-11 font-bold text-signal underline underline-offset-4 hover:text-signal-strong">
            Send another question
          </button>
        </p>
      </div>
    );

  const general =
    error && !Object.keys(serverFields).length
      ? error.status === 429
        ? {
            title: "Too many questions in a short time",
            body: `${error.message} Please wait a few minutes and send it again — what you wrote is still here. Or call ${dealership.name} on ${dealership.phone}.`,
          }
        : error.status === 404
          ? { title: "This vehicle is no longer on sale", body: `It may have just been sold or reserved. Call ${dealership.name} on ${dealership.phone} to ask.` }
          : { title: "Your question was not sent", body: `${error.message} What you wrote is still here; try again in a moment.` }
      : null;

  return (
    <form ref={formRef} onSubmit={(e) => (submit.isPending ? e.preventDefault() : void onSubmit(e))} noValidate aria-label={`Ask about the ${vehicleTitle}`} className="flex flex-col gap-5">
      {general ? (
        <Notice tone={error?.status === 429 ? "caution" : "danger"} title={general.title} role="alert">
          {general.body}
        </Notice>
      ) : count ? (
        <Notice tone="danger" title={count === 1 ? "One thing to check before we can send this" : `${count} things to check before we can send this`} role="alert">
          Each is marked below. Nothing you typed has been lost.
        </Notice>
      ) : null}

      <TextField label="Your name" autoComplete="name" {...field("name")} error={msg("name")} />

      <fieldset className="flex flex-col gap-4 rounded-lg border border-line p-4">
        <legend className="px-1 text-sm font-bold">How can we reach you?</legend>
        <p className="-mt-1 text-sm text-ink-soft">Give at least one: an e-mail address, a phone number, or both.</p>
        <TextField label="E-mail" type="email" inputMode="email" autoComplete="email" {...field("email")} error={msg("email")} />
        <TextField label="Phone" type="tel" inputMode="tel" autoComplete="tel" {...field("phone")} error={msg("phone")} />
      </fieldset>

      <TextAreaField
        label="Your question"
        {...field("message")}
        error={msg("message")}
        hint="For example: can I see it on Saturday, is the price open to a trade-in, has the timing belt been changed."
        rows={5}
      />

      <fieldset className="flex flex-col gap-1" aria-describedby={fields.preferredContact ? `${uid}-pref-error` : undefined}>
        <legend className="mb-1 text-sm font-bold">How should we contact you?</legend>
        <div className="flex flex-col gap-1 sm:flex-row sm:gap-6">
          {CONTACT_PREFERENCES.map((p) => (
            <label key={p} className="flex min-h-11 items-center gap-3 text-base">
              <input type="radio" {...field("preferredContact")} value={p} className="size-5 accent-signal" />
              <span>
                {CONTACT_LABELS[p]} <span className="text-sm text-ink-soft">— {CONTACT_HINTS[p]}</span>
              </span>
            </label>
          ))}
        </div>
        {fields.preferredContact ? (
          <p id={`${uid}-pref-error`} className="text-sm font-bold text-brick">
            {fields.preferredContact}
          </p>
        ) : null}
      </fieldset>

      <div className="rounded-lg border border-line">
        <button
          type="button"
          aria-expanded={tradeInOpen}
          aria-controls={`${uid}-tradein`}
          onClick={() => form.setValue("tradeInOpen", !tradeInOpen)}
          className="flex min-h-11 w-full items-center justify-between gap-3 px-4 py-3 text-left font-bold"
        >
          <span>
            I have a vehicle to trade in <span className="font-normal text-ink-soft">(optional)</span>
          </span>
          <span aria-hidden className="text-ink-soft">
            {tradeInOpen ? "−" : "+"}
          </span>
        </button>
        {tradeInOpen ? (
          <div id={`${uid}-tradein`} className="grid grid-cols-1 gap-4 border-t border-line px-4 py-4 sm:grid-cols-2">
            <TextField label="Make" {...field("tradeIn.make")} error={msg("tradeIn.make")} autoComplete="off" />
            <TextField label="Model" {...field("tradeIn.model")} error={msg("tradeIn.model")} autoComplete="off" />
            <TextField label="Year" inputMode="numeric" {...field("tradeIn.year")} error={msg("tradeIn.year")} autoComplete="off" />
            <TextField
              label="Odometer"
              inputMode="numeric"
              {...field("tradeIn.odometerKm")}
              error={msg("tradeIn.odometerKm")}
              after={<span className="unit">km</span>}
              autoComplete="off"
            />
          </div>
        ) : null}
      </div>

      {/* For scripts only: people never see this field, and the server discards anything that fills it. */}
      <div aria-hidden="true" className="absolute -left-[10000px] top-auto size-px overflow-hidden">
        <label htmlFor={`${uid}-website`}>Leave this field empty</label>
        <input id={`${uid}-website`} type="text" tabIndex={-1} autoComplete="off" {...form.register("website")} />
      </div>

      <CheckboxField
        {...field("consent")}
        error={msg("consent")}
        label="You may contact me about this vehicle. My details are used for this enquiry only."
      />

      <Button type="submit" busy={submit.isPending} className="w-full sm:w-auto sm:self-start">
        Send my question
      </Button>
      <p className="text-sm text-ink-soft">
        Sent to {dealership.name}. Prefer to talk? Call{" "}
        <a href={`tel:${dealership.phone.replace(/[^\d+]/g, "")}`}>{dealership.phone}</a> or write to <a href={`mailto:${dealership.email}`}>{dealership.email}</a>.
      </p>
    </form>
  );
}
