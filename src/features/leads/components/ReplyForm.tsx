import { useState } from "react";
import { useReplyToLead, type LeadDetail } from "../api/leads.ts";
import { TextAreaField } from "../../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors, useZodForm } from "../../../components/form/use-zod-form.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { leadMessageSchema } from "../../../../shared/schemas/enquiries.ts";

/** A reply by e-mail from the dealership's address; it is kept in the conversation with its delivery state. */
export function ReplyForm({ lead }: { lead: LeadDetail }) {
  const reply = useReplyToLead(lead.id);
  const form = useZodForm(leadMessageSchema, { defaultValues: { body: "" } });
  const [sent, setSent] = useState(false);
  const noEmail = !lead.email;
  const error = reply.error;
  const fieldError = form.formState.errors.body?.message;

  const submit = form.handleSubmit(
    (values) => {
      setSent(false);
      reply.mutate(values, {
        onSuccess: () => {
          form.reset({ body: "" });
          setSent(true);
        },
        onError: (e) => setServerErrors(form, e),
      });
    },
    () => setSent(false),
  );

  if (noEmail)
    return (
      <div className="flex flex-col gap-3">
        <TextAreaField label={`Your reply to ${lead.name}`} disabled value="" rows={3} />
        <Notice tone="info" title="No e-mail address to reply to">
          {lead.name} gave only a phone number{lead.phone ? (
            <>
              : call <a href={`tel:${lead.phone.replace(/[^\d+]/g, "")}`}>{lead.phone}</a>
            </>
          ) : null}
          , then add a note of the call below.
        </Notice>
      </div>
    );

  return (
    <form onSubmit={onSubmitOf(submit)} noValidate className="flex flex-col gap-3">
      {sent ? <Notice tone="success" title="Reply queued">It goes out from the dealership's address within a moment; its state shows in the conversation.</Notice> : null}
      {error && !fieldError ? <Notice tone="danger" title="The reply was not sent">{error.message} Your text is still here.</Notice> : null}
      <TextAreaField
        label={`Your reply to ${lead.name}`}
        {...form.register("body", { onChange: () => setSent(false) })}
        error={fieldError}
        hint={<>Goes to <span className="font-mono">{lead.email}</span> with a link to the condition page.</>}
        rows={6}
      />
      <Button type="submit" busy={reply.isPending} className="self-start">
        Send reply by e-mail
      </Button>
    </form>
  );
}
