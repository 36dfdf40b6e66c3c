import { useState, type FormEvent, type ReactNode } from "react";
import { TextField } from "../../components/form/Field.tsx";
import { Button } from "../../components/ui/Button.tsx";
import { Notice } from "../../components/feedback/Notice.tsx";
import { tokenPasswordSchema } from "../../../shared/schemas/enquiries.ts";
import { zodFields } from "../../../shared/schemas/fields.ts";

/**
 * A new password typed twice, checked here with the server's own rule (at least 12 characters) before it is sent.
 * The server also refuses common passwords; its message lands under the first field.
 */
export function NewPasswordForm({
  token,
  submitLabel,
  busy,
  serverFields,
  serverError,
  username,
  onSubmit,
}: {
  token: string;
  submitLabel: string;
  busy: boolean;
  serverFields: Record<string, string>;
  serverError?: ReactNode;
  /** For password managers: the account the password belongs to. */
  username?: string;
  onSubmit: (password: string) => void;
}) {
  const [password, setPassword] = useState("");
  const [again, setAgain] = useState("");
  const [fields, setFields] = useState<Record<string, string>>({});
  const shown = { ...serverFields, ...fields };

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = tokenPasswordSchema.safeParse({ token, password });
    const next = parsed.success ? {} : zodFields(parsed.error);
    delete next.token;
    if (password && again !== password) next.again = "The two passwords are not the same.";
    if (!again && password) next.again = "Type the password again.";
    setFields(next);
    if (Object.keys(next).length) return;
    onSubmit(password);
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {serverError ? <Notice tone="danger" title={serverError} /> : null}
      {username ? <input type="text" name="username" autoComplete="username" value={username} readOnly hidden /> : null}
      <TextField
        label="New password"
        type="password"
        name="password"
        autoComplete="new-password"
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={shown.password}
        hint="At least 12 characters. A few unrelated words make a strong password you can remember."
      />
      <TextField label="The same password again" type="password" name="again" autoComplete="new-password" value={again} onChange={(e) => setAgain(e.target.value)} error={shown.again} />
      <Button type="submit" busy={busy} className="mt-2 w-full">
        {submitLabel}
      </Button>
    </form>
  );
}
