import { Link } from "react-router";
import { useRequestReset } from "../../features/accounts/api/accounts.ts";
import { PublicFrame } from "../../features/accounts/PublicFrame.tsx";
import { TextField } from "../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors, useZodForm } from "../../components/form/use-zod-form.ts";
import { Button } from "../../components/ui/Button.tsx";
import { Notice } from "../../components/feedback/Notice.tsx";
import { resetRequestSchema } from "../../../shared/schemas/enquiries.ts";

export default function ForgotPassword() {
  const request = useRequestReset();
  const form = useZodForm(resetRequestSchema, { defaultValues: { email: "" } });
  const error = request.error;
  const fieldError = form.formState.errors.email?.message;

  const submit = form.handleSubmit((values) => request.mutate(values, { onError: (e) => setServerErrors(form, e) }));

  if (request.isSuccess)
    return (
      <PublicFrame title="Check your inbox">
        <Notice tone="success" title="Request received">
          {request.data.message}
        </Notice>
        <p className="mt-6 text-sm text-ink-soft">
          Nothing after a few minutes? Look in the spam folder, or ask an admin at your dealership. <Link to="/sign-in">Back to sign-in</Link>
        </p>
      </PublicFrame>
    );

  return (
    <PublicFrame title="Forgotten your password?" lead="Give the e-mail address you sign in with. We send a link to choose a new password.">
      <form onSubmit={onSubmitOf(submit)} noValidate className="flex flex-col gap-5">
        {error && !fieldError ? (
          <Notice tone={error.status === 429 ? "caution" : "danger"} title={error.status === 429 ? "Too many requests just now" : "Not sent"}>
            {error.message}
          </Notice>
        ) : null}
        <TextField label="E-mail" type="email" inputMode="email" autoComplete="username" {...form.register("email")} error={fieldError} />
        <Button type="submit" busy={request.isPending} className="mt-2 w-full">
          Send me a link
        </Button>
      </form>
      <p className="mt-8 text-sm text-ink-soft">
        Remembered it? <Link to="/sign-in">Sign in</Link>
      </p>
    </PublicFrame>
  );
}
