import { useState, type FormEvent } from "react";
import { useShareVehicle } from "../api/leads.ts";
import { isApiError } from "../../../lib/api-client.ts";
import { TextAreaField, TextField } from "../../../components/form/Field.tsx";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { shareVehicleSchema } from "../../../../shared/schemas/enquiries.ts";
import { zodFields } from "../../../../shared/schemas/fields.ts";

const blank = { email: "", name: "", message: "" };

/** Sales send a buyer the condition page by e-mail. Only a published page can be sent. */
export function ShareVehicle({ vehicleId, published }: { vehicleId: number; published: boolean }) {
  const share = useShareVehicle(vehicleId);
  const [form, setForm] = useState(blank);
  const [clientFields, setClientFields] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const error = share.error;
  const fields = { ...(isApiError(error) ? error.fields : {}), ...clientFields };
  const set = (key: keyof typeof blank) => (e: { target: { value: string } }) => {
    setForm({ ...form, [key]: e.target.value });
    setDone(null);
  };

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = shareVehicleSchema.safeParse(form);
    if (!parsed.success) return setClientFields(zodFields(parsed.error));
    setClientFields({});
    share.mutate(parsed.data, {
      onSuccess: () => {
        setDone(`The condition page is on its way to ${parsed.data.email}.`);
        setForm(blank);
      },
    });
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label="Send the condition page to a buyer">
      {!published ? (
        <Notice tone="info" title="Publish the vehicle first">
          Buyers can only open a published condition page, so there is nothing to send yet.
        </Notice>
      ) : null}
      {done ? <Notice tone="success" title={done} /> : null}
      {error && !Object.keys(fields).length ? <Notice tone="danger" title="Not sent">{error.message} What you typed is still here.</Notice> : null}
      <fieldset disabled={!published || share.isPending} className="flex flex-col gap-4 disabled:opacity-70">
        <TextField label="Buyer's e-mail" name="email" type="email" inputMode="email" autoComplete="off" value={form.email} onChange={set("email")} error={fields.email} />
        <TextField label="Buyer's name (optional)" name="name" autoComplete="off" value={form.name} onChange={set("name")} error={fields.name} />
        <TextAreaField label="A short message (optional)" name="message" value={form.message} onChange={set("message")} error={fields.message} rows={3} hint="Sent above the link, from the dealership's address." />
        <Button type="submit" tone="secondary" busy={share.isPending} className="self-start">
          Send the condition page
        </Button>
      </fieldset>
    </form>
  );
}
