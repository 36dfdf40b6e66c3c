import { useState } from "react";
import { useUpdateDealership, type DealershipView } from "../api/dealership.ts";
import { CheckboxField, SelectField, TextAreaField, TextField } from "../../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors, useZodFormAsTyped } from "../../../components/form/use-zod-form.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { Panel } from "../../../components/ui/Page.tsx";
import { MARKET_CODES, type MarketCode } from "../../../../shared/constants/market.ts";
import { MARKETS } from "../../../../shared/domain/markets.ts";
import { dealershipSettingsSchema } from "../../../../shared/schemas/dealership.ts";

type Form = Record<string, string | boolean>;

const TEXT = ["name", "addressLine", "town", "region", "postcode", "licenceNumber", "phone", "email", "website", "currency", "disclaimerMarkdown", "market", "distanceUnit"] as const;
const NUMBERS = ["legalMinTreadMm", "newTyreTreadMm", "serviceIntervalKm", "serviceIntervalMonths", "minPhotos"] as const;

const toForm = (d: DealershipView): Form => ({
  ...Object.fromEntries(TEXT.map((k) => [k, String(d[k] ?? "")])),
  ...Object.fromEntries(NUMBERS.map((k) => [k, String(d[k])])),
  vinCheckDigitMandatory: d.vinCheckDigitMandatory,
});

/** The form as typed → the settings body: numbers parsed (empty means not given), against the version shown. */
const toBody = (version: number) => (form: Form) => {
  const body: Record<string, unknown> = { version };
  for (const k of TEXT) body[k] = form[k];
  for (const k of NUMBERS) body[k] = form[k] === "" ? null : Number(form[k]);
  body.vinCheckDigitMandatory = form.vinCheckDigitMandatory;
  return body;
};

export function SettingsForm({ dealership }: { dealership: DealershipView }) {
  const update = useUpdateDealership();
  const form = useZodFormAsTyped<Form, typeof dealershipSettingsSchema>(dealershipSettingsSchema, toBody(dealership.version), {
    defaultValues: toForm(dealership),
  });
  const { errors } = form.formState;
  const [saved, setSaved] = useState(false);
  const text = (k: string) => ({ ...form.register(k), error: errors[k]?.message });

  function applyMarket(code: MarketCode) {
    const p = MARKETS[code];
    form.setValue("distanceUnit", p.distanceUnit);
    form.setValue("currency", p.currency);
    form.setValue("legalMinTreadMm", String(p.legalMinimumTreadMm));
    form.setValue("vinCheckDigitMandatory", p.vinCheckDigitMandatory);
  }

  const submit = form.handleSubmit(
    (body) => {
      setSaved(false);
      update.mutate(body, {
        onSuccess: ({ dealership: d }) => {
          form.reset(toForm(d));
          setSaved(true);
        },
        onError: (e) => setServerErrors(form, e),
      });
    },
    () => setSaved(false),
  );

  const preset = MARKETS[form.watch("market") as MarketCode];
  return (
    <form onSubmit={onSubmitOf(submit)} noValidate className="flex flex-col gap-6">
      {saved ? <Notice tone="success" title="Settings saved" /> : null}
      {update.error ? (
        <Notice tone="danger" title={update.error.message}>
          {update.error.status === 409 ? "Reload the page to see the newer settings; your edits are still in the form below." : null}
        </Notice>
      ) : null}
      <Panel title="The dealership">
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Trading name" {...text("name")} />
          <TextField label="Dealer licence number" {...text("licenceNumber")} hint="Shown on every public page." />
          <TextField label="Street address" {...text("addressLine")} />
          <TextField label="Town" {...text("town")} />
          <TextField label="Region or state" {...text("region")} />
          <TextField label="Postcode" {...text("postcode")} />
          <TextField label="Phone" type="tel" {...text("phone")} />
          <TextField label="E-mail for enquiries" type="email" {...text("email")} />
          <TextField label="Website" type="url" {...text("website")} hint="Optional. Starts with https://" />
        </div>
      </Panel>
      <Panel title="Market rules">
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField label="Market" {...form.register("market", { onChange: (e: { target: { value: string } }) => applyMarket(e.target.value as MarketCode) })} error={errors.market?.message} hint={preset ? `Tread minimum from ${preset.treadSource.replace(/\s*\(TRADE\.md[^)]*\)/, "")}.` : undefined}>
            {MARKET_CODES.map((m) => (
              <option key={m} value={m}>{MARKETS[m].name}</option>
            ))}
          </SelectField>
          <SelectField label="Distance unit" {...text("distanceUnit")}>
            <option value="km">Kilometres</option>
            <option value="mi">Miles</option>
          </SelectField>
          <TextField label="Currency (ISO 4217)" {...text("currency")} maxLength={3} className="font-mono uppercase" />
          <TextField label="Legal minimum tread depth" inputMode="decimal" {...text("legalMinTreadMm")} after={<span className="unit">mm</span>} hint="Tyres below this fail the walk-around. Local law decides; check it." />
          <TextField label="New-tyre tread depth" inputMode="decimal" {...text("newTyreTreadMm")} after={<span className="unit">mm</span>} hint="Used to show remaining tread as a percentage." />
          <div className="self-end">
            <CheckboxField label="A failed VIN check digit is an error (North American VINs)" {...form.register("vinCheckDigitMandatory")} />
          </div>
          <TextField label="Service interval (distance)" inputMode="numeric" {...text("serviceIntervalKm")} after={<span className="unit">km</span>} />
          <TextField label="Service interval (time)" inputMode="numeric" {...text("serviceIntervalMonths")} after={<span className="unit">months</span>} />
        </div>
      </Panel>
      <Panel title="Publishing">
        <div className="grid gap-4">
          <TextField label="Minimum photos before a vehicle may go live" inputMode="numeric" {...text("minPhotos")} className="max-w-32" />
          <TextAreaField label="Disclaimer shown on every condition page (Markdown)" {...text("disclaimerMarkdown")} rows={5} />
        </div>
      </Panel>
      <div>
        <Button type="submit" busy={update.isPending}>Save settings</Button>
      </div>
    </form>
  );
}
