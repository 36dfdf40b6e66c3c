import { useState } from "react";
import { useShareVehicle } from "../api/leads.ts";
import { TextAreaField, TextField } from "../../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors, topError, useZodForm } from "../../../components/form/use-zod-form.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { shareVehicleSchema } from "../../../../shared/schemas/enquiries.ts";

const blank = { email: "", name: "", message: "" };

/** Sales send a buyer the condition page by e-mail. Only a published page can be sent. */
export function ShareVehicle({ vehicleId, published }: { vehicleId: number; published: boolean }) {
  const share = useShareVehicle(vehicleId);
  const form = useZodForm(shareVehicleSchema, { defaultValues: blank });
  const { errors } = form.formState;
  const [done, setDone] = useState<string | null>(null);
  const problem = topError(share.error);
  // Typing again means the last "sent" is no longer news.
  const field = (key: keyof typeof blank) => form.register(key, { onChange: () => setDone(null) });

  const submit = form.handleSubmit((values) =>
    share.mutate(values, {
      onSuccess: () => {
        setDone(`The condition page is on its way to ${values.email}.`);
        form.reset(blank);
      },
      onError: (e) => setServerErrors(form, e),
    }),
  );

  return (
    <form onSubmit={onSubmitOf(submit)} noValidate className="flex flex-col gap-4" aria-label="Send the condition page to a buyer">
      {!published ? (
        <Notice tone="info" title="Publish the vehicle first">
          Buyers can only open a published condition page, so there is nothing to send yet.
        </Notice>
      ) : null}
      {done ? <Notice tone="success" title={done} /> : null}
      {problem ? <Notice tone="danger" title="Not sent">{problem.message} What you typed is still here.</Notice> : null}
      <fieldset disabled={!published || share.isPending} className="flex flex-col gap-4 disabled:opacity-70">
        <TextField label="Buyer's e-mail" type="email" inputMode="email" autoComplete="off" {...field("email")} error={errors.email?.message} />
        <TextField label="Buyer's name (optional)" autoComplete="off" {...field("name")} error={errors.name?.message} />
        <TextAreaField label="A short message (optional)" {...field("message")} error={errors.message?.message} rows={3} hint="Sent above the link, from the dealership's address." />
        <Button type="submit" tone="secondary" busy={share.isPending} className="self-start">
          Send the condition page
        </Button>
      </fieldset>
    </form>
  );
}
