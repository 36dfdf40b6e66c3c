import { useState, type FormEvent } from "react";
import { Link } from "react-router";
import { useRequestReset } from "../../features/accounts/api/accounts.ts";
import { PublicFrame } from "../../features/accounts/PublicFrame.tsx";
import { isApiError } from "../../lib/api-client.ts";
import { TextField } from "../../components/form/Field.tsx";
import { Button } from "../../components/ui/Button.tsx";
import { Notice } from "../../components/feedback/Notice.tsx";
import { resetRequestSchema } from "../../../shared/schemas/enquiries.ts";
import { zodFields } from "../../../shared/schemas/fields.ts";

export default function ForgotPassword() {
  const request = useRequestReset();
  const [email, setEmail] = useState("");
  const [clientError, setClientError] = useState<string | undefined>();
  const error = request.error;
  const fieldError = clientError ?? (isApiError(error) ? error.fields.email : undefined);

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = resetRequestSchema.safeParse({ email });
    if (!parsed.success) return setClientError(zodFields(parsed.error).email);
    setClientError(undefined);
    request.mutate(parsed.data);
  }

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
      <form onSubmit={submit} noValidate className="flex flex-col gap-5">
        {error && !fieldError ? (
          <Notice tone={error.status === 429 ? "caution" : "danger"} title={error.status === 429 ? "Too many requests just now" : "Not sent"}>
            {error.message}
          </Notice>
        ) : null}
        <TextField label="E-mail" type="email" name="email" inputMode="email" autoComplete="username" value={email} onChange={(e) => setEmail(e.target.value)} error={fieldError} />
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
